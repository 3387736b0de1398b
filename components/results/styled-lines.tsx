import type { LineCustomSvgLayerProps, LineSeries } from "@nivo/line";

export interface LineStyle {
  color: string;
  dash?: string;
  width?: number;
}

/**
 * A replacement for nivo's line layer that draws each series in its own stroke: nivo styles
 * all lines alike, and dashes are what tell usable torque or a claimed scenario apart from the
 * solid line without relying on colour.
 */
export function styledLinesLayer<S extends LineSeries>(styles: Record<string, LineStyle>) {
  return function StyledLines({ series, lineGenerator }: LineCustomSvgLayerProps<S>) {
    return (
      <g>
        {series.map((s) => {
          const style = styles[String(s.id)];
          return (
            <path
              key={String(s.id)}
              d={lineGenerator(s.data.map((d) => d.position)) ?? undefined}
              fill="none"
              stroke={style?.color ?? s.color}
              strokeWidth={style?.width ?? 2.5}
              strokeDasharray={style?.dash}
              strokeLinejoin="round"
            />
          );
        })}
      </g>
    );
  };
}
