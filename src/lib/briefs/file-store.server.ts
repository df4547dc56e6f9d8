/** The app's uploads: the folder store under UPLOAD_DIR and the app's database. */
import { config } from '../platform/config';
import { db } from '../platform/db';
import type { SignedInUser } from '../platform/http/guard';
import { findBriefFileFor, saveBriefFile, type UploadInput } from './files.server';
import { folderStore } from '../platform/uploads/store';

export const uploadStore = folderStore(config.uploadDir);

export const saveUpload = (input: UploadInput) => saveBriefFile({ db, store: uploadStore }, input);

export const findFileFor = (viewer: SignedInUser, fileId: string) => findBriefFileFor(db, viewer, fileId);
