/**
 * The admin's view of outgoing mail: every attempt the app logged, and —
 * where the local mail catcher is configured — what it actually received.
 */
import { desc } from 'drizzle-orm';
import type { MessageSummary, StoredMessage } from '../../../../mail-catcher/src/stored-message';
import { config } from '../config';
import { db } from '../db';
import { mailLog } from '../db/schema';
import { withoutSecrets } from './redact';

/** Rows logged before bodies were stored without tokens are shown without them too. */
export async function listMailLog(limit = 100) {
  const rows = await db.select().from(mailLog).orderBy(desc(mailLog.createdAt)).limit(limit);
  return rows.map((row) => ({ ...row, bodyText: withoutSecrets(row.bodyText) }));
}

export type CaughtMessage = Omit<StoredMessage, 'rawBase64' | 'attachments'> & { attachments: MessageSummary['attachments'] };

export type CatcherView =
  | { configured: false }
  | { configured: true; url: string; ok: true; messages: CaughtMessage[] }
  | { configured: true; url: string; ok: false; error: string };

/** Catcher message ids are its own file names: letters, digits, dots and dashes. */
export const isCatcherId = (id: string) => /^[\w.-]{1,100}$/.test(id);

async function fetchJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { signal: AbortSignal.timeout(3_000) });
  if (!response.ok) throw new Error(`${url} answered ${response.status}`);
  return (await response.json()) as T;
}

/** The newest messages the catcher holds, with their bodies. */
export async function caughtMessages(limit = 25): Promise<CatcherView> {
  const url = config.mailCatcherUrl;
  if (!url) return { configured: false };
  try {
    const summaries = (await fetchJson<MessageSummary[]>(`${url}/messages`)).slice(0, limit);
    const full = await Promise.all(
      summaries.map((s) => fetchJson<Omit<StoredMessage, 'rawBase64'>>(`${url}/messages/${encodeURIComponent(s.id)}`)),
    );
    const messages = full.map((m, i) => ({
      ...m,
      text: m.text === null ? null : withoutSecrets(m.text),
      html: m.html === null ? null : withoutSecrets(m.html),
      attachments: summaries[i]?.attachments ?? [],
    }));
    return { configured: true, url, ok: true, messages };
  } catch (err) {
    return { configured: true, url, ok: false, error: err instanceof Error ? err.message : String(err) };
  }
}

/** One attachment as the catcher received it, passed through for download; null when it has no such thing. */
export async function caughtAttachment(id: string, index: number): Promise<Response | null> {
  const url = config.mailCatcherUrl;
  if (!url || !isCatcherId(id) || !Number.isInteger(index) || index < 0) return null;
  const response = await fetch(`${url}/messages/${encodeURIComponent(id)}/attachments/${index}`, {
    signal: AbortSignal.timeout(3_000),
  }).catch(() => null);
  if (!response?.ok) return null;
  return new Response(response.body, {
    headers: {
      'content-type': response.headers.get('content-type') ?? 'application/octet-stream',
      'content-disposition': response.headers.get('content-disposition') ?? `attachment; filename="attachment-${index}"`,
      'cache-control': 'private, no-store',
    },
  });
}
