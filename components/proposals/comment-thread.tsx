"use client";

import { useState, useTransition } from "react";
import { Badge } from "@/components/ui/badge";
import { DECISION_LABELS } from "@/lib/glossary";
import type { ActionResult } from "@/server/actions/result";
import type { MailDelivery } from "@/server/mail/delivery";
import { SubmitRow, type FormMessage } from "@/components/ui/submit-row";

export type ThreadComment = {
  id: number;
  body: string;
  decision: "accept" | "changes" | "decline" | null;
  createdAt: string;
  authorName: string;
  authorRole: "engineer" | "manager" | "reviewer" | "admin";
};

const DECISION_TONE = { accept: "success", changes: "caution", decline: "danger" } as const;

const when = (iso: string) => `${iso.replace("T", " ").slice(0, 16)} UTC`;

/** The conversation on a proposal between the customer's reviewer and the vendor's people. */
export function CommentThread({
  comments,
  post,
  placeholder,
}: {
  comments: ThreadComment[];
  post: (values: {
    body: string;
  }) => Promise<ActionResult<{ id: number; mail: MailDelivery | null }>>;
  placeholder: string;
}) {
  const [body, setBody] = useState("");
  const [message, setMessage] = useState<FormMessage>(null);
  const [pending, start] = useTransition();

  function submit(event: React.FormEvent) {
    event.preventDefault();
    start(async () => {
      const result = await post({ body });
      if (!result.ok)
        return setMessage({ tone: "error", text: result.fieldErrors.body ?? result.message });
      setBody("");
      setMessage({
        tone: "ok",
        text:
          result.data.mail?.status === "queued"
            ? `Comment posted. ${result.data.mail.notice}`
            : "Comment posted.",
      });
    });
  }

  return (
    <div className="space-y-4">
      {comments.length === 0 ? (
        <p className="text-small text-steel-700">No comments yet.</p>
      ) : (
        <ol className="space-y-3" aria-label="Comments">
          {comments.map((c) => {
            const customer = c.authorRole === "reviewer";
            return (
              <li
                key={c.id}
                className={`rounded-md border p-3 ${customer ? "border-flux-200 bg-flux-50" : "border-steel-200 bg-white"}`}
              >
                <p className="flex flex-wrap items-center gap-2 text-small">
                  <span className="font-bold text-steel-900">{c.authorName}</span>
                  <span className="text-steel-600">{customer ? "customer" : "supplier"}</span>
                  <span className="text-steel-600">· {when(c.createdAt)}</span>
                  {c.decision ? (
                    <Badge tone={DECISION_TONE[c.decision]} term="decision">
                      {DECISION_LABELS[c.decision]}
                    </Badge>
                  ) : null}
                </p>
                {c.body ? (
                  <p className="mt-1 whitespace-pre-wrap text-body text-steel-900">{c.body}</p>
                ) : null}
              </li>
            );
          })}
        </ol>
      )}
      <form onSubmit={submit} className="space-y-2" aria-label="New comment">
        <label htmlFor="comment-body" className="block text-small font-bold text-steel-800">
          Your comment
        </label>
        <textarea
          id="comment-body"
          value={body}
          onChange={(e) => setBody(e.target.value)}
          rows={3}
          maxLength={4000}
          placeholder={placeholder}
          className="block w-full rounded-md border border-steel-300 bg-white px-3 py-2 text-body"
        />
        <SubmitRow
          label="Post comment"
          variant="secondary"
          pending={pending}
          pendingLabel="Posting…"
          disabled={!body.trim()}
          message={message}
        />
      </form>
    </div>
  );
}
