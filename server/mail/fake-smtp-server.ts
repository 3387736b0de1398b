// No "server-only" guard here: lib/cli/app-server.ts and lib/cli/start.ts load this file with
// plain tsx, outside a React Server Component bundle, where the guard would throw.
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import type { Db } from "../../db/client";
import { outbox } from "../../db/schema/mail";

export type FakeSmtpServer = { port: number; url: string; close: () => Promise<void> };

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? "").filter(Boolean));
}

/**
 * The local stand-in for a mail server: a real SMTP server (smtp-server) on loopback that accepts
 * every message, parses it with mailparser and files it in the outbox table, where the
 * administrator's outbox page and the tests read it. Nothing leaves the machine.
 */
export function startFakeSmtpServer(
  db: Db,
  { port = 0, host = "127.0.0.1" }: { port?: number; host?: string } = {},
): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Loopshift local mail catcher",
    size: 10 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelope = session.envelope.rcptTo.map((r) => r.address);
          db.insert(outbox)
            .values({
              messageId: parsed.messageId ?? null,
              fromAddress: addresses(parsed.from).join(", ") || null,
              to: (addresses(parsed.to).length ? addresses(parsed.to) : envelope).join(", "),
              subject: parsed.subject ?? "",
              text: parsed.text ?? "",
              html: typeof parsed.html === "string" ? parsed.html : "",
            })
            .run();
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      const address = server.server.address();
      const bound = typeof address === "object" && address ? address.port : port;
      resolve({
        port: bound,
        url: `smtp://${host}:${bound}`,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
