import { Fragment } from 'react';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { ApiError } from '@/lib/api-client';
import { useMail, type DevMail } from '../api/list-mail';

/** Shows a message's text with its links clickable (they point back into this app). */
function MailText({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/\S+)/g);
  return (
    <p className="whitespace-pre-wrap break-words">
      {parts.map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={part} className="font-bold text-text underline underline-offset-4">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </p>
  );
}

function Message({ mail }: { mail: DevMail }) {
  return (
    <article className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3">
      <h2 className="text-lg font-extrabold">{mail.subject || '(no subject)'}</h2>
      <p className="text-sm text-muted">
        To {mail.to.join(', ')} · {new Date(mail.receivedAt).toLocaleString()}
      </p>
      <MailText text={mail.text} />
    </article>
  );
}

export function Mailbox() {
  const mail = useMail();
  if (mail.isPending) return <Loading label="Opening the mailbox…" />;
  if (mail.isError) {
    // The server answers only this machine, or an owner signed in from another device.
    const notHere = mail.error instanceof ApiError && mail.error.status === 404;
    return (
      <Notice
        tone="info"
        title={
          notHere
            ? 'There is no local mailbox here. On a home install it opens on the computer running Rackside, or here once you sign in as an owner.'
            : mail.error.message
        }
      />
    );
  }
  const mine = mail.data.scope === 'mine';
  if (!mail.data.messages.length)
    return (
      <Notice
        tone="info"
        title={
          mine ? 'No e-mail to you yet.' : 'No e-mail yet. Messages the app sends appear here.'
        }
      />
    );
  return (
    <div className="flex flex-col gap-3">
      {mine && (
        <Notice
          tone="info"
          title="From this device you see only the e-mail sent to you. The computer running Rackside shows all of it."
        />
      )}
      {mail.data.messages.map((m) => (
        <Message key={m.id} mail={m} />
      ))}
    </div>
  );
}
