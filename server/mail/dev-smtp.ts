import { randomUUID } from 'node:crypto';

export interface StoredMail {
  id: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
  /** Files that came with the message (invoices, care sheets): names, types and bytes. */
  attachments?: { filename: string; contentType: string; content: Buffer }[];
}

/** Every message the local SMTP fake received, newest last. */
export class DevMailbox {
  readonly messages: StoredMail[] = [];
  private waiters: (() => void)[] = [];

  add(mail: StoredMail) {
    this.messages.push(mail);
    if (this.messages.length > 500) this.messages.shift();
    for (const wake of this.waiters.splice(0)) wake();
  }

  /** Resolves with the first message matching `match`, waiting for it to arrive if needed. */
  async waitFor(match: (m: StoredMail) => boolean, timeoutMs = 5000): Promise<StoredMail> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.messages.find(match);
      if (found) return found;
      const left = deadline - Date.now();
      if (left <= 0) throw new Error('No matching e-mail arrived in time.');
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, left);
        this.waiters.push(() => {
          clearTimeout(timer);
          resolve();
        });
      });
    }
  }
}

export interface DevSmtp {
  url: string;
  mailbox: DevMailbox;
  stop(): Promise<void>;
}

/**
 * A loopback SMTP server that keeps what it receives: e-mail without a mail provider. Its
 * packages are imported here, not at the top, so a server given SMTP_URL never loads them.
 */
export async function startDevSmtp(): Promise<DevSmtp> {
  const [{ simpleParser }, { SMTPServer }] = await Promise.all([
    import('mailparser'),
    import('smtp-server'),
  ]);
  const mailbox = new DevMailbox();
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          mailbox.add({
            id: randomUUID(),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            receivedAt: new Date().toISOString(),
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? 'attachment',
              contentType: a.contentType,
              content: a.content,
            })),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    url: `smtp://127.0.0.1:${port}`,
    mailbox,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
