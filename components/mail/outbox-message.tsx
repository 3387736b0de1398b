import { Fragment } from "react";

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** The plain-text part with its links clickable, as a mail program shows them. */
function TextWithLinks({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    // wrap-anywhere: an invitation's long link breaks too, so a narrow screen never scrolls sideways.
    <pre className="whitespace-pre-wrap wrap-anywhere font-sans text-small text-steel-900">
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="font-bold text-flux-700 underline">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </pre>
  );
}

export type OutboxEntry = {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
};

/** One caught message: its headers, then both parts (the HTML one in a sandbox, no scripts). */
export function OutboxMessage({ message, open }: { message: OutboxEntry; open: boolean }) {
  return (
    <details
      open={open}
      className="rounded-md border border-steel-200 bg-white"
      data-testid="outbox-message"
    >
      <summary className="flex cursor-pointer flex-wrap items-baseline justify-between gap-2 px-4 py-3">
        <span className="font-bold text-steel-900">{message.subject}</span>
        <span className="text-small text-steel-700">
          to {message.to} · {message.createdAt.replace("T", " ").slice(0, 19)} UTC
        </span>
      </summary>
      <div className="grid gap-4 border-t border-steel-200 p-4 xl:grid-cols-2">
        <section aria-label="Plain-text part" className="min-w-0">
          <h3 className="mb-2 text-caption font-bold uppercase tracking-wide text-steel-600">
            Plain text
          </h3>
          <TextWithLinks text={message.text} />
        </section>
        <section aria-label="HTML part" className="min-w-0">
          <h3 className="mb-2 text-caption font-bold uppercase tracking-wide text-steel-600">
            HTML
          </h3>
          {message.html ? (
            <iframe
              title={`HTML part of “${message.subject}”`}
              srcDoc={message.html}
              sandbox=""
              className="h-[28rem] w-full rounded border border-steel-200 bg-white"
            />
          ) : (
            <p className="text-small text-steel-700">This message has no HTML part.</p>
          )}
        </section>
      </div>
    </details>
  );
}
