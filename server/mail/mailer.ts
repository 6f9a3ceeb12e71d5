import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Sales — S: files sent with the message (an invoice PDF, care sheets). */
  attachments?: MailAttachment[];
}

export interface MailAttachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

export interface Mailer {
  /** Rejects unless the SMTP server accepted the message: callers may retry. */
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createSmtpMailer(smtpUrl: string, from: string): Mailer {
  const url = new URL(smtpUrl);
  // Our loopback fake speaks plain SMTP; anything else negotiates TLS as usual.
  const local = url.hostname === '127.0.0.1' || url.hostname === 'localhost';
  const transport = nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 587)),
    secure: url.protocol === 'smtps:',
    ignoreTLS: local,
    auth: url.username
      ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) }
      : undefined,
  });
  return {
    /** Resolves once the SMTP server has accepted the message for every recipient. */
    async send(mail) {
      const info = await transport.sendMail({ from, ...mail });
      // nodemailer resolves when at least one recipient was accepted (RFC 5321, 3.3).
      if (info.rejected.length)
        throw new Error(
          `The mail server refused ${info.rejected.length} recipient(s): ${info.response}`,
        );
    },
    close: () => transport.close(),
  };
}
