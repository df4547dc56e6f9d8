/**
 * The brief's thread with its client, shown to both sides (the client's brief page and the
 * review page). Writing posts to the messages API; the other side is e-mailed a link.
 */
import { useRef, useState } from 'react';
import type { MessageJson } from '~/lib/briefs/messages.server';
import { formatSi } from '~/lib/engine/units';
import { guessKind, uploadFile } from './uploads';

/** What the file picker offers: the types the upload path accepts (it checks the bytes itself). */
const ACCEPT = '.pdf,.png,.jpg,.jpeg,.webp,.gif,.csv,.txt';

interface Props {
  briefId: string;
  initial: MessageJson[];
  /** Which side is reading: their own messages sit on the right. */
  viewer: 'client' | 'consultancy';
  /** Null when the thread is open; otherwise why nobody can write yet. */
  closedReason: string | null;
  /** How many files one message may carry (the server's limit, passed in so the island ships no schema). */
  maxAttachments: number;
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

export default function MessageThread({ briefId, initial, viewer, closedReason, maxAttachments }: Props) {
  const [messages, setMessages] = useState(initial);
  const [draft, setDraft] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [files, setFiles] = useState<File[]>([]);
  const [progress, setProgress] = useState<string | null>(null);
  const picker = useRef<HTMLInputElement>(null);
  const otherSide = viewer === 'client' ? 'the consultancy' : 'the client';

  function pick(chosen: FileList | null) {
    const all = [...files, ...(chosen ? [...chosen] : [])];
    setError(all.length > maxAttachments ? `Attach at most ${maxAttachments} files to one message.` : null);
    setFiles(all.slice(0, maxAttachments));
    if (picker.current) picker.current.value = '';
  }

  /** Each file goes up through the brief's upload path first; the message then names them. */
  async function uploadAll(): Promise<string[]> {
    const ids: string[] = [];
    for (const [index, file] of files.entries()) {
      setProgress(`Uploading ${file.name} (${index + 1} of ${files.length})…`);
      // A text file sent with a message is a document, not a load log to be reduced.
      const kind = guessKind(file) === 'load-log' ? 'other' : guessKind(file);
      ids.push((await uploadFile(briefId, file, kind, () => undefined)).id);
    }
    return ids;
  }

  async function send(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setError(null);
    try {
      let attachmentIds: string[];
      try {
        attachmentIds = await uploadAll();
      } catch (failed) {
        setError(`${failed instanceof Error ? failed.message : 'The upload failed.'} The message was not sent.`);
        return;
      }
      const response = await fetch(`/api/v1/briefs/${briefId}/messages`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ body: draft, attachmentIds }),
      });
      const body = (await response.json().catch(() => ({}))) as MessageJson & { message?: string; issues?: { message: string }[] };
      if (!response.ok) {
        setError(body.issues?.[0]?.message ?? body.message ?? `The message was not sent (${response.status}); try again.`);
        return;
      }
      setMessages((all) => [...all, body]);
      setDraft('');
      setFiles([]);
    } catch {
      setError('The server could not be reached; your message is still here. Try again.');
    } finally {
      setBusy(false);
      setProgress(null);
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
                {m.attachments.length > 0 && (
                  <ul className="mt-2 flex flex-col gap-1 border-t border-rule pt-2" aria-label="Attached files">
                    {m.attachments.map((a) => (
                      <li key={a.id} className="break-all">
                        <a href={`/api/v1/files/${a.id}`} className="font-semibold">
                          {a.name}
                        </a>
                        <span className="text-ink-faint"> · {formatSi(a.sizeBytes, 'B')}</span>
                      </li>
                    ))}
                  </ul>
                )}
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
          <div className="flex flex-col gap-1">
            <label htmlFor="message-files" className="text-sm font-semibold">
              Attach files{' '}
              <span className="font-normal text-ink-soft">(optional; up to {maxAttachments}, 10 MB each: PDF, pictures, CSV or text)</span>
            </label>
            <input
              id="message-files"
              ref={picker}
              type="file"
              multiple
              accept={ACCEPT}
              onChange={(e) => pick(e.target.files)}
              className="text-sm"
            />
            {files.length > 0 && (
              <ul className="flex flex-col gap-1 text-sm" aria-label="Files to send with this message">
                {files.map((file, index) => (
                  <li key={`${file.name}-${index}`} className="flex flex-wrap items-center gap-2">
                    <span className="break-all">{file.name}</span>
                    <span className="text-ink-faint">{formatSi(file.size, 'B')}</span>
                    <button
                      type="button"
                      onClick={() => setFiles((all) => all.filter((_, i) => i !== index))}
                      className="rounded border border-ink/25 px-2 text-xs hover:border-ink/60"
                      aria-label={`Remove ${file.name}`}
                    >
                      Remove
                    </button>
                  </li>
                ))}
              </ul>
            )}
          </div>
          {progress && (
            <p role="status" className="text-sm text-ink-soft">
              {progress}
            </p>
          )}
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
