import type { Response } from 'express';

/** Answers with a PDF to save under a file name, never kept by a cache (it holds records). */
export function sendPdf(res: Response, pdf: Buffer, fileName: string): void {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(pdf);
}
