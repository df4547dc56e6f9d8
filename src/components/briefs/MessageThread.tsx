/**
 * The brief's thread with its client, shown to both sides (the client's brief page and the
 * review page). Writing posts to the messages API; the other side is e-mailed a link.
 */
import { useState } from 'react';
import type { MessageJson } from '~/lib/briefs/messages.server';

interface Props {
  briefId: string;
  initial: MessageJson[];
  /** Which side is reading: their own messages sit on the right. */
  viewer: 'client' | 'consultancy';
  /** Null when the thread is open; otherwise why nobody can write yet. */
  closedReason: string | null;
}

const when = (iso: string) =>
  new Date(iso).toLocaleString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    timeZone: 'UTC',
  }) + ' UTC';

export default function MessageThread({ briefId, initial, viewer, closedReason }: Props) {
  const [messages, setMessages] = useState(initial);
  const [draft, setDraft] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const otherSide = viewer === 'client' ? 'the consultancy' : 'the client';

  async function send(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const response = await fetch(`/api/v1/briefs/${briefId}/messages`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ body: draft }),
      });
      const body = (await response.json().catch(() => ({}))) as MessageJson & { message?: string; issues?: { message: string }[] };
      if (!response.ok) {
        setError(body.issues?.[0]?.message ?? body.message ?? `The message was not sent (${response.status}); try again.`);
        return;
      }
      setMessages((all) => [...all, body]);
      setDraft('');
    } catch {
      setError('The server could not be reached; your message is still here. Try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <section id="messages" aria-labelledby="messages-heading" className="scroll-mt-20">
      <h2 id="messages-heading" className="text-xl font-bold">
        Messages
      </h2>
      <p className="text-sm text-ink-soft">Between the client and the consultancy; both sides read these, and each message is e-mailed.</p>
      {messages.length === 0 ? (
        <p className="mt-3 text-sm text-ink-soft">No messages yet.</p>
      ) : (
        <ol className="mt-3 flex flex-col gap-2" aria-label="Messages, oldest first">
          {messages.map((m) => {
            const own = m.author.side === viewer;
            return (
              <li
                key={m.id}
                className={`max-w-[92%] rounded-lg border p-3 text-sm ${own ? 'self-end border-copper-500/40 bg-copper-50' : 'self-start border-rule bg-card'}`}
              >
                <p className="whitespace-pre-line break-words">{m.body}</p>
                <p className="mt-1 text-xs text-ink-faint">
                  {m.author.name}
                  {m.author.side === 'consultancy' ? ' (consultancy)' : ' (client)'} · {when(m.createdAt)}
                </p>
              </li>
            );
          })}
        </ol>
      )}
      {closedReason ? (
        <p className="mt-3 text-sm text-ink-soft">{closedReason}</p>
      ) : (
        <form onSubmit={(e) => void send(e)} className="mt-3 flex flex-col gap-2">
          <label htmlFor="message-body" className="text-sm font-semibold">
            Write to {otherSide}
          </label>
          <textarea
            id="message-body"
            rows={3}
            maxLength={4000}
            required
            value={draft}
            onChange={(e) => setDraft(e.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? 'message-error' : undefined}
            className={`rounded-md border bg-card px-3 py-2 ${error ? 'border-stop-700' : 'border-ink/25'}`}
          />
          {error && (
            <p id="message-error" role="alert" className="text-sm font-medium text-stop-700">
              <span aria-hidden="true">✕ </span>
              {error}
            </p>
          )}
          <button
            type="submit"
            disabled={busy || draft.trim() === ''}
            className="self-start rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
          >
            {busy ? 'Sending…' : 'Send message'}
          </button>
        </form>
      )}
    </section>
  );
}
