import { Fragment } from "react";
import { Table, Td, Th } from "@/components/ui/table";
import {
  METHOD_CAUTIONS,
  METHOD_DEFAULTS,
  METHOD_LEAD,
  METHOD_LIMITS,
  METHOD_SECTIONS,
  METHOD_SOURCES,
} from "@/lib/method/model";
import { equationParts, inlineParts, type MethodBlock } from "@/lib/method/types";

/** Text with the model's `_{…}` / `^{…}` notation as real sub- and superscripts. */
function Inline({ text }: { text: string }) {
  return (
    <>
      {inlineParts(text).map((part, i) =>
        part.kind === "sub" ? (
          <sub key={i}>{part.text}</sub>
        ) : part.kind === "sup" ? (
          <sup key={i}>{part.text}</sup>
        ) : (
          <Fragment key={i}>{part.text}</Fragment>
        ),
      )}
    </>
  );
}

function Block({ block }: { block: MethodBlock }) {
  switch (block.kind) {
    case "p":
      return (
        <p className="max-w-3xl text-steel-900">
          <Inline text={block.text} />
        </p>
      );
    case "eq":
      return (
        <div
          role="group"
          aria-label="Equations"
          className="max-w-3xl space-y-2 rounded-md border-l-4 border-flux-500 bg-flux-50 px-4 py-3"
        >
          {block.lines.map((line) => {
            const { formula, gloss } = equationParts(line);
            return (
              <p key={line}>
                <span className="block break-words whitespace-pre-wrap text-steel-900 tabular-nums">
                  <Inline text={formula} />
                </span>
                {gloss ? (
                  <span className="block text-caption text-steel-700">
                    <Inline text={gloss} />
                  </span>
                ) : null}
              </p>
            );
          })}
        </div>
      );
    case "list":
      return (
        <ul className="max-w-3xl list-disc space-y-1.5 pl-5 text-steel-900">
          {block.items.map((item) => (
            <li key={item}>
              <Inline text={item} />
            </li>
          ))}
        </ul>
      );
    case "table":
      return (
        <div className="max-w-3xl">
          <Table caption={block.caption}>
            <thead>
              <tr>
                {block.head.map((h) => (
                  <Th key={h}>{h}</Th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {block.rows.map((row) => (
                <tr key={row[0]}>
                  {row.map((c, i) => (
                    <Td key={i} className={i > 0 ? "tabular-nums" : ""}>
                      <Inline text={c} />
                    </Td>
                  ))}
                </tr>
              ))}
            </tbody>
          </Table>
          <p className="mt-1 text-caption text-steel-600">{block.caption}.</p>
        </div>
      );
  }
}

const EXTRA_SECTIONS = [
  { id: "defaults", title: "Defaults" },
  { id: "sources", title: "Sources of the check values" },
  { id: "limits", title: "Limits" },
  { id: "safety", title: "Safety" },
];

// Marks the bases that have no single published source (or one not yet checked), so that they
// are never read as a citation.
const isPractice = (basis: string) => /common practice|rule of thumb|claim|from memory/.test(basis);

/**
 * The method page's body, the same for the vendor's people and the customer's reviewer: the
 * model in our own words with its equations, the defaults and what they rest on, the sources of
 * the check values, the limits and the safety cautions. Rendered from lib/method/model.ts, which
 * also generates docs/model.md.
 */
export function MethodArticle() {
  const contents = [
    ...METHOD_SECTIONS.map((s) => ({ id: s.id, title: s.title })),
    ...EXTRA_SECTIONS,
  ];
  return (
    <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
      <nav aria-label="On this page" className="lg:sticky lg:top-6 lg:self-start">
        <p className="text-caption font-bold uppercase tracking-wide text-steel-600">
          On this page
        </p>
        <ol className="mt-2 space-y-1 border-l border-steel-200 text-small">
          {contents.map((c) => (
            <li key={c.id}>
              <a
                href={`#${c.id}`}
                className="-ml-px block border-l-2 border-transparent py-0.5 pl-3 text-steel-700 hover:border-flux-500 hover:text-flux-800 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-flux-600"
              >
                {c.title}
              </a>
            </li>
          ))}
        </ol>
      </nav>

      <article className="min-w-0 space-y-10">
        <p className="max-w-3xl text-lead text-steel-800">{METHOD_LEAD}</p>

        {METHOD_SECTIONS.map((section) => (
          <section
            key={section.id}
            id={section.id}
            aria-labelledby={`${section.id}-title`}
            className="scroll-mt-6 space-y-4"
          >
            <h2 id={`${section.id}-title`} className="text-title">
              {section.title}
            </h2>
            {section.blocks.map((block, i) => (
              <Block key={i} block={block} />
            ))}
          </section>
        ))}

        <section id="defaults" aria-labelledby="defaults-title" className="scroll-mt-6 space-y-4">
          <h2 id="defaults-title" className="text-title">
            Defaults
          </h2>
          <p className="max-w-3xl text-steel-900">
            Every default can be changed in the case&apos;s assumptions or on the axis. Those marked{" "}
            <PracticeMark basis="" /> have no single published source: they are common practice, a
            rule of thumb or a claim of the trade.
          </p>
          <Table caption="Defaults of the input and what each rests on">
            <thead>
              <tr>
                <Th>Setting</Th>
                <Th>Default</Th>
                <Th>Rests on</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {METHOD_DEFAULTS.map((d) => (
                <tr key={d.setting}>
                  <Td className="font-bold">{d.setting}</Td>
                  <Td>{d.value}</Td>
                  <Td>
                    {isPractice(d.basis) ? <PracticeMark basis={d.basis} /> : null} {d.basis}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </section>

        <section id="sources" aria-labelledby="sources-title" className="scroll-mt-6 space-y-4">
          <h2 id="sources-title" className="text-title">
            Sources of the check values
          </h2>
          <p className="max-w-3xl text-steel-900">
            The engine&apos;s tests compare its results with these outside values. A value marked
            “from memory” has not yet been confirmed against its document; “common practice” has no
            single source.
          </p>
          <Table caption="Each check value and where it comes from">
            <thead>
              <tr>
                <Th>Check</Th>
                <Th>Value</Th>
                <Th>Source</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {METHOD_SOURCES.map((s) => (
                <tr key={s.check}>
                  <Td className="font-bold">{s.check}</Td>
                  <Td className="tabular-nums">
                    <Inline text={s.value} />
                  </Td>
                  <Td>
                    {isPractice(s.source) ? <PracticeMark basis={s.source} /> : null} {s.source}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </section>

        <section id="limits" aria-labelledby="limits-title" className="scroll-mt-6 space-y-4">
          <h2 id="limits-title" className="text-title">
            Limits
          </h2>
          <ul className="max-w-3xl list-disc space-y-1.5 pl-5 text-steel-900">
            {METHOD_LIMITS.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </section>

        <section id="safety" aria-labelledby="safety-title" className="scroll-mt-6 space-y-4">
          <h2 id="safety-title" className="text-title">
            Safety
          </h2>
          <ul className="max-w-3xl space-y-3">
            {METHOD_CAUTIONS.map((c) => (
              <li
                key={c}
                className="rounded-md border-l-4 border-caution-600 bg-caution-50 py-2 pr-3 pl-3 text-steel-900"
              >
                {c}
              </li>
            ))}
          </ul>
        </section>
      </article>
    </div>
  );
}

function PracticeMark({ basis }: { basis: string }) {
  return (
    <span className="inline-flex items-center rounded-full bg-coil-100 px-2 py-0.5 text-caption font-bold whitespace-nowrap text-coil-800">
      {/from memory/.test(basis) ? "not yet confirmed" : "no single source"}
    </span>
  );
}
