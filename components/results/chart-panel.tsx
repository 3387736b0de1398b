"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";

/**
 * A chart with its title, a line saying what it shows, and a switch to the same numbers as a
 * table — for readers who prefer figures and for screen readers, which cannot read an SVG plot.
 * nivo's responsive charts measure their parent, so the chart box gets an explicit height.
 */
export function ChartPanel({
  title,
  description,
  height = 320,
  controls,
  legend,
  table,
  initialAsTable = false,
  children,
}: {
  title: string;
  description?: string;
  height?: number;
  controls?: ReactNode;
  legend?: ReactNode;
  table: ReactNode;
  /** Open on the table (a table sorted through the URL comes back as a table). */
  initialAsTable?: boolean;
  /** The chart, or a function of the chart box's width for charts that thin their ticks. */
  children: ReactNode | ((size: { width: number }) => ReactNode);
}) {
  const [asTable, setAsTable] = useState(initialAsTable);
  const descriptionId = useId();
  const box = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const element = box.current;
    if (!element || typeof ResizeObserver === "undefined") return;
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(element);
    return () => observer.disconnect();
  }, [asTable]);
  return (
    <Panel
      title={title}
      actions={
        <Button
          variant="secondary"
          size="sm"
          className="print:hidden"
          onClick={() => setAsTable((v) => !v)}
        >
          {asTable ? "Show as chart" : "Show as table"}
        </Button>
      }
    >
      {description ? (
        <p id={descriptionId} className="mb-3 text-small text-steel-700">
          {description}
        </p>
      ) : null}
      {controls ? <div className="mb-3">{controls}</div> : null}
      {asTable ? (
        table
      ) : (
        <figure aria-describedby={description ? descriptionId : undefined}>
          <div ref={box} style={{ height }} className="w-full">
            {typeof children === "function" ? children({ width }) : children}
          </div>
          {legend ? <figcaption className="mt-2">{legend}</figcaption> : null}
        </figure>
      )}
    </Panel>
  );
}

/** Phone-width charts get fewer ticks so that their labels do not run into each other. */
export const isNarrow = (width: number) => width > 0 && width < 480;

/** A legend of line samples, so dashed and solid series are told apart by more than colour. */
export function LineLegend({
  items,
}: {
  items: { label: string; color: string; dash?: string; marker?: boolean }[];
}) {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-small text-steel-800">
      {items.map((item) => (
        <li key={item.label} className="flex items-center gap-2">
          <svg width="28" height="12" aria-hidden="true" className="shrink-0">
            {item.marker ? (
              <circle cx="14" cy="6" r="5" fill={item.color} stroke="#ffffff" strokeWidth="1.5" />
            ) : (
              <line
                x1="1"
                y1="6"
                x2="27"
                y2="6"
                stroke={item.color}
                strokeWidth="2.5"
                strokeDasharray={item.dash}
              />
            )}
          </svg>
          {item.label}
        </li>
      ))}
    </ul>
  );
}

/** A legend of filled swatches for bar charts. */
export function SwatchLegend({ items }: { items: { label: string; color: string }[] }) {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-small text-steel-800">
      {items.map((item) => (
        <li key={item.label} className="flex items-center gap-2">
          <span
            aria-hidden="true"
            className="inline-block h-3 w-3 rounded-sm"
            style={{ backgroundColor: item.color }}
          />
          {item.label}
        </li>
      ))}
    </ul>
  );
}
