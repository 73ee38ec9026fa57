import { useState } from 'react';
import type { MailMessage } from '../../../../shared/api/accounts';
import { errorMessage } from '../../../app/http';
import { EmptyState, ErrorNote, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { useMail } from '../api/admin';

/** Message text with its links made clickable (set-password and review links). */
function Body({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <pre className="whitespace-pre-wrap break-words font-sans text-sm leading-relaxed text-stone-900">
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="break-all text-accent-700 underline">
            {p}
          </a>
        ) : (
          <span key={i}>{p}</span>
        ),
      )}
    </pre>
  );
}

export function MailboxPage() {
  const mail = useMail();
  const [openId, setOpenId] = useState<number | null>(null);
  const list = mail.data ?? [];
  const open: MailMessage | undefined = list.find((m) => m.id === openId) ?? list[0];
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Mailbox</h1>
        <p className="text-sm text-stone-600">Mail sent by this installation and held by its local mail server, newest first. Nothing here left the machine.</p>
      </div>
      {mail.isPending ? (
        <Spinner label="Loading mail" />
      ) : mail.isError ? (
        <ErrorNote title="The mailbox could not be loaded">{errorMessage(mail.error)}</ErrorNote>
      ) : list.length === 0 ? (
        <EmptyState title="No mail yet">Invitations, password resets and review notices appear here.</EmptyState>
      ) : (
        <div className="grid gap-4 md:grid-cols-[minmax(0,22rem)_1fr]">
          <ul aria-label="Messages" className="flex max-h-[70vh] flex-col overflow-y-auto rounded-lg border border-stone-200 bg-white">
            {list.map((m) => {
              const selected = open?.id === m.id;
              return (
                <li key={m.id} className="border-b border-stone-100 last:border-0">
                  <button
                    type="button"
                    aria-current={selected ? 'true' : undefined}
                    onClick={() => setOpenId(m.id)}
                    className={`flex w-full flex-col gap-0.5 px-3 py-2 text-left ${selected ? 'bg-accent-50' : 'hover:bg-stone-50'}`}
                  >
                    <span className="text-sm font-medium text-stone-900">{m.subject}</span>
                    <span className="truncate text-xs text-stone-700">to {m.recipients.join(', ')}</span>
                    <span className="text-xs text-stone-600">{formatDateTime(m.at)}</span>
                  </button>
                </li>
              );
            })}
          </ul>
          {open ? (
            <article aria-labelledby="mail-subject" data-testid="mail-message" className="rounded-lg border border-stone-200 bg-white p-4">
              <h2 id="mail-subject" className="text-lg font-semibold">
                {open.subject}
              </h2>
              <dl className="mt-1 grid grid-cols-[4rem_1fr] gap-x-2 text-xs text-stone-700">
                <dt>From</dt>
                <dd>{open.sender}</dd>
                <dt>To</dt>
                <dd>{open.recipients.join(', ')}</dd>
                <dt>Sent</dt>
                <dd>{formatDateTime(open.at)}</dd>
              </dl>
              <div className="mt-3 border-t border-stone-200 pt-3">
                <Body text={open.text} />
              </div>
            </article>
          ) : null}
        </div>
      )}
    </div>
  );
}
