import { useState } from 'react';
import type { MailMessage } from '@shared/schemas/mail';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDateTime, formatWhen } from '@/lib/format';
import { AutolinkedText } from './autolinked-text';
import { MailHtmlFrame } from './mail-html-frame';

export function MailInbox({ messages }: { messages: MailMessage[] }) {
  const [selectedId, setSelectedId] = useState<number | null>(null);
  if (messages.length === 0) {
    return (
      <EmptyState title="No mail yet">
        Invitations and password-reset links sent from this workspace appear here.
      </EmptyState>
    );
  }
  const selected = messages.find((message) => message.id === selectedId) ?? messages[0]!;

  return (
    <div className="grid grid-cols-1 items-start gap-gutter lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      <ul aria-label="Messages, newest first" className="flex flex-col gap-2">
        {messages.map((message) => {
          const active = message.id === selected.id;
          return (
            <li key={message.id}>
              <button
                type="button"
                aria-current={active ? 'true' : undefined}
                onClick={() => setSelectedId(message.id)}
                className={cn(
                  'w-full rounded-card border px-4 py-3 text-left transition-colors',
                  active ? 'border-frost-400 bg-frost-50' : 'border-ink-100 bg-surface hover:border-ink-300',
                )}
              >
                <span className="flex items-baseline justify-between gap-3">
                  <span className="truncate font-bold text-ink-900">{message.subject || '(no subject)'}</span>
                  <time dateTime={message.receivedAt} className="shrink-0 text-caption text-ink-500">
                    {formatWhen(message.receivedAt)}
                  </time>
                </span>
                <span className="block truncate text-small text-ink-600">To {message.to.join(', ')}</span>
              </button>
            </li>
          );
        })}
      </ul>
      <MessageView key={selected.id} message={selected} />
    </div>
  );
}

function MessageView({ message }: { message: MailMessage }) {
  const [view, setView] = useState<'html' | 'text'>(message.html ? 'html' : 'text');
  return (
    <article aria-labelledby="mail-subject" className="rounded-card border border-ink-100 bg-surface p-5 shadow-card">
      <header className="border-b border-ink-100 pb-4">
        <h2 id="mail-subject" className="text-title font-bold text-ink-950">
          {message.subject || '(no subject)'}
        </h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-small">
          <dt className="font-semibold text-ink-500">From</dt>
          <dd className="break-all text-ink-800">{message.from}</dd>
          <dt className="font-semibold text-ink-500">To</dt>
          <dd className="break-all text-ink-800">{message.to.join(', ')}</dd>
          <dt className="font-semibold text-ink-500">Received</dt>
          <dd className="text-ink-800">{formatDateTime(message.receivedAt)}</dd>
        </dl>
        {message.html && (
          <div role="group" aria-label="Show the message as" className="mt-4 inline-flex rounded-control border border-ink-200 p-0.5">
            {(['html', 'text'] as const).map((option) => (
              <Button
                key={option}
                size="sm"
                variant={view === option ? 'primary' : 'ghost'}
                aria-pressed={view === option}
                onClick={() => setView(option)}
              >
                {option === 'html' ? 'Formatted' : 'Plain text'}
              </Button>
            ))}
          </div>
        )}
      </header>
      <div className="pt-4">
        {view === 'html' && message.html ? (
          <MailHtmlFrame html={message.html} title={message.subject} />
        ) : (
          <AutolinkedText text={message.text} />
        )}
      </div>
    </article>
  );
}
