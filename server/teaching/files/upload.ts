/** One uploaded file per request, in memory, with size and type limits; anything else is refused before a route sees it. */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../../errors';
import { FileRejected } from './json-text';
import { TYPED_CONTROL } from '../../security/control-characters';

const UPLOAD_MAX_BYTES = 256 * 1024;

export type FileKind = 'json' | 'csv';

/** Media types browsers and tools send for each kind; the extension decides, the type must not contradict it. */
const TYPES: Record<FileKind, string[]> = {
  json: ['application/json', 'text/json', 'text/plain', 'application/octet-stream'],
  csv: ['text/csv', 'application/csv', 'application/vnd.ms-excel', 'text/plain', 'application/octet-stream'],
};

export function fileKindOf(name: string): FileKind | null {
  const ext = /\.([a-z]+)$/i.exec(name)?.[1]?.toLowerCase();
  return ext === 'json' || ext === 'csv' ? ext : null;
}

/** Accepts one file in the field "file" whose kind is among `kinds`; sets req.file. */
export function uploadOne(kinds: FileKind[]): RequestHandler {
  const allowed = kinds.map((k) => `.${k}`).join(' or ');
  const handler = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 4, fieldSize: 1024, parts: 6 },
    fileFilter: (_req, file, done) => {
      const kind = fileKindOf(file.originalname);
      if (!kind || !kinds.includes(kind)) {
        return done(new HttpError(415, 'UNSUPPORTED_FILE', `Rackside reads ${allowed} files here; "${file.originalname}" is neither. Pick a ${allowed} file.`, { file: `Pick a ${allowed} file.` }));
      }
      const type = file.mimetype.split(';')[0].trim().toLowerCase();
      if (!TYPES[kind].includes(type)) {
        return done(new HttpError(415, 'UNSUPPORTED_FILE', `"${file.originalname}" was sent as ${type}, which is not a ${kind.toUpperCase()} file.`, { file: `Pick a ${allowed} file.` }));
      }
      done(null, true);
    },
  }).single('file');
  return (req, res, next) => {
    handler(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(new HttpError(400, 'NO_FILE', 'Choose a file to upload.', { file: 'Choose a file to upload.' }));
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, 'FILE_TOO_LARGE', `The file is larger than ${UPLOAD_MAX_BYTES / 1024} KB. Nothing was saved.`, { file: `Pick a file under ${UPLOAD_MAX_BYTES / 1024} KB.` }));
        }
        return next(new HttpError(400, 'BAD_UPLOAD', 'Send one file in the field "file", nothing else.', { file: 'Send one file.' }));
      }
      if (err instanceof HttpError) return next(err);
      // The parser's own complaints (a cut-short body, a bad part header, no boundary) are the sender's.
      next(new HttpError(400, 'BAD_UPLOAD', 'The upload was cut short or malformed. Send the file again, as one file in the field "file".', { file: 'Send the file again.' }));
    });
  };
}

/** The uploaded bytes as text, or a refusal when they are not UTF-8 text. */
export function uploadedText(file: Express.Multer.File): string {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
    if (text.includes('\u0000')) throw new Error('binary');
  } catch {
    throw new HttpError(415, 'UNSUPPORTED_FILE', 'The file is not text (UTF-8). Export it again as JSON or CSV.', { file: 'The file is not text.' });
  }
  text = text.replace(/^\uFEFF/, '');
  const bad = TYPED_CONTROL.exec(text);
  if (bad) {
    const before = text.slice(0, bad.index);
    const line = before.split('\n').length;
    const column = bad.index - before.lastIndexOf('\n');
    const where = `line ${line}, column ${column}`;
    throw new HttpError(400, 'BAD_FILE', `The file was not imported: ${where} holds a control character, which no Rackside text may hold. Remove it and import again. Nothing was saved.`, { file: `${where}: remove the control character.` });
  }
  return text;
}

/**
 * A broken file as an API error: every problem in the fields by where it is (problems at the same
 * place share one entry), the first one in `file`, and their number in the message.
 */
export function fileError(err: FileRejected): HttpError {
  const [first] = err.problems;
  const count = err.problems.length;
  const fields: Record<string, string> = { file: `${first.where}: ${first.message}` };
  for (const p of err.problems) fields[p.where] = fields[p.where] ? `${fields[p.where]} ${p.message}` : p.message;
  const summary = count > 1 ? `${count} problems, each listed by its place. The first: ` : '';
  return new HttpError(400, 'BAD_FILE', `The file was not imported: ${summary}${first.where}: ${first.message} Nothing was saved.`, fields);
}
