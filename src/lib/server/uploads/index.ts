/** The app's uploads: the folder store under UPLOAD_DIR and the app's database. */
import { config } from '../config';
import { db } from '../db';
import type { SignedInUser } from '../guard';
import { findBriefFileFor, saveBriefFile, type UploadInput } from './brief-files';
import { folderStore } from './store';

export const uploadStore = folderStore(config.uploadDir);

export const saveUpload = (input: UploadInput) => saveBriefFile({ db, store: uploadStore }, input);

export const findFileFor = (viewer: SignedInUser, fileId: string) => findBriefFileFor(db, viewer, fileId);
