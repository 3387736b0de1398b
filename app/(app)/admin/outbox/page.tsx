import type { Metadata } from "next";
import { OutboxMessage } from "@/components/mail/outbox-message";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { listOutbox, listWaitingMail } from "@/db/queries/outbox";
import { requirePageUser } from "@/server/auth";

export const metadata: Metadata = { title: "Outbox" };

export default async function OutboxPage() {
  const admin = await requirePageUser("admin");
  const messages = listOutbox(admin);
  const waiting = listWaitingMail(admin);
  return (
    <div className="space-y-6">
      <PageHeader
        title="Outbox"
        lead="Every message the local mail server caught, newest first. With SMTP_URL set to a real server, messages go out instead and do not appear here."
      />
      {waiting.length ? (
        <Panel title={`Waiting for the mail server (${waiting.length})`}>
          <p className="mb-3 text-small text-steel-700">
            These could not be handed over yet; they are retried automatically.
          </p>
          <Table caption="Messages waiting for the mail server">
            <thead>
              <tr>
                <Th>To</Th>
                <Th>Subject</Th>
                <Th className="text-right">Attempts</Th>
                <Th>Next attempt (UTC)</Th>
                <Th>Last error</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {waiting.map((m) => (
                <tr key={m.id}>
                  <Td>{m.to}</Td>
                  <Td>{m.subject}</Td>
                  <Td className="text-right tabular-nums">{m.attempts}</Td>
                  <Td className="whitespace-nowrap tabular-nums">
                    {m.nextAttemptAt.replace("T", " ").slice(0, 19)}
                  </Td>
                  <Td className="text-small text-danger-700">{m.lastError}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Panel>
      ) : null}
      {messages.length === 0 ? (
        <EmptyState title="No message caught yet">
          Messages appear here when a proposal is sent, decided or commented on.
        </EmptyState>
      ) : (
        <div className="space-y-3">
          {messages.map((m, i) => (
            <OutboxMessage key={m.id} message={m} open={i === 0} />
          ))}
        </div>
      )}
    </div>
  );
}
