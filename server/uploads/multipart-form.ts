import type { RequestHandler } from 'express';
import multer from 'multer';

/** One file field of a multipart form. Browsers send file names as UTF-8 without saying so; busboy's default (latin1) would garble "Prüfschein.pdf". */
export function multipartForm(fileSize: number): RequestHandler {
  return multer({ storage: multer.memoryStorage(), defParamCharset: 'utf8', limits: { fileSize, files: 1, fields: 5 } }).single('file');
}
