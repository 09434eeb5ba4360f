/** Sending a drill or pattern-list file as a download. */
import type { Response } from 'express';

/** A file name from a drill or list name: letters, digits and dashes only. */
export function fileStem(name: string) {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'list';
}

export function download(res: Response, filename: string, type: string, body: string) {
  res.setHeader('Content-Type', `${type}; charset=utf-8`);
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(body);
}
