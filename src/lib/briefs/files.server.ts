/**
 * Files attached to briefs: saving an upload (bytes first, then the row, and
 * the bytes removed again when the row cannot be written, so a failed upload
 * leaves nothing behind) and finding one for a viewer.
 */
import { eq } from 'drizzle-orm';
import { reduceLoadLog, type LoadSummary } from './load-log';
import type { Database } from '../platform/db/connect';
import { brief, briefFile, type BriefState, type BriefFileRow } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { safeFileName } from '../platform/uploads/file-names';
import { decideUploadType, MAX_UPLOAD_BYTES, uploadTooLarge, type FileKind } from '../platform/uploads/file-policy';
import { invalidInput, notYours, refuse, succeed, type Outcome, type Refusal } from '../platform/outcome';
import { newStorageKey, type UploadStore } from '../platform/uploads/store';

export interface BriefFileDeps {
  db: Database;
  store: UploadStore;
}

/** A brief in one of these states is closed: nothing more is attached to it. */
export const CLOSED_BRIEF_STATES: readonly BriefState[] = ['declined', 'cancelled', 'delivered', 'paid-in-full', 'expired'];

export const isClosedBrief = (state: BriefState) => CLOSED_BRIEF_STATES.includes(state);

export interface UploadInput {
  briefId: string;
  uploaderId: string;
  kind: FileKind | undefined;
  name: string;
  bytes: Uint8Array;
}

export interface SavedFile {
  id: string;
  name: string;
  kind: FileKind;
  mimeType: string;
  sizeBytes: number;
  loadSummary: LoadSummary | null;
}

export const closedMessage = (state: BriefState) => `This brief is ${state}; files can no longer be added to it.`;

const unreadable = (code: 'invalid_upload' | 'invalid_load_log', message: string) => invalidInput(code, [{ path: 'file', message }]);

/** Raised inside the transaction so that the row is rolled back and the bytes removed. */
class BriefUnavailable extends Error {
  constructor(readonly refusal: Refusal) {
    super('The brief cannot take files now.');
  }
}

export async function saveBriefFile({ db, store }: BriefFileDeps, input: UploadInput): Promise<Outcome<SavedFile>> {
  const { bytes } = input;
  if (bytes.length === 0) return unreadable('invalid_upload', 'The file is empty.');
  if (bytes.length > MAX_UPLOAD_BYTES) return uploadTooLarge();

  const verdict = await decideUploadType(bytes, input.name, input.kind);
  if (!verdict.ok) return refuse('unsupported-type', verdict.message, { code: 'file_type_not_accepted' });
  const { type } = verdict;

  let loadSummary: LoadSummary | null = null;
  if (type.kind === 'load-log') {
    const reduced = reduceLoadLog(type.text ?? '');
    if (!reduced.ok) return unreadable('invalid_load_log', reduced.message);
    loadSummary = reduced.summary;
  }

  const name = safeFileName(input.name, type.extensions);
  const storageKey = newStorageKey();
  await store.put(storageKey, bytes);
  try {
    const row = await db.transaction(async (tx) => {
      // Read inside the (write-locked) transaction: a brief closed meanwhile takes no file.
      const [target] = await tx.select({ state: brief.state }).from(brief).where(eq(brief.id, input.briefId)).limit(1);
      if (!target) throw new BriefUnavailable(notYours());
      if (isClosedBrief(target.state)) throw new BriefUnavailable(refuse('wrong-state', closedMessage(target.state)));
      const [inserted] = await tx
        .insert(briefFile)
        .values({
          briefId: input.briefId,
          uploadedBy: input.uploaderId,
          kind: type.kind,
          originalName: name,
          storageKey,
          mimeType: type.mimeType,
          sizeBytes: bytes.length,
          loadSummary,
        })
        .returning({ id: briefFile.id });
      return inserted!;
    });
    return succeed({ id: row.id, name, kind: type.kind, mimeType: type.mimeType, sizeBytes: bytes.length, loadSummary });
  } catch (error) {
    await store.remove(storageKey);
    if (error instanceof BriefUnavailable) return error.refusal;
    throw error;
  }
}

export type { BriefFileRow };

/** The file if this viewer may see its brief, else null (answered as 404 either way). */
export async function findBriefFileFor(db: Database, viewer: SignedInUser, fileId: string): Promise<BriefFileRow | null> {
  const [found] = await db
    .select({ file: briefFile, ownerId: brief.ownerId })
    .from(briefFile)
    .innerJoin(brief, eq(brief.id, briefFile.briefId))
    .where(eq(briefFile.id, fileId))
    .limit(1);
  if (!found) return null;
  if (!isStaff(viewer) && found.ownerId !== viewer.id) return null;
  return found.file;
}
