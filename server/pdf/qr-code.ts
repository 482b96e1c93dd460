import QRCode from 'qrcode';

/**
 * Light modules around the symbol that a reader needs to find it.
 * source: ISO/IEC 18004:2015, 7.3.8 "Quiet zone" (four modules wide on every side)
 */
export const QUIET_ZONE_MODULES = 4;

/**
 * Error correction level M: about 15 % of the symbol can be smudged or creased and still read.
 * source: ISO/IEC 18004:2015, 4.3 (levels L, M, Q, H recover about 7, 15, 25 and 30 %)
 */
const ERROR_CORRECTION = 'M';

/** A QR code's modules: `dark[row][column]`, each row left to right, top row first. */
export type QrMatrix = readonly (readonly boolean[])[];

/** The modules of the QR code of a text, as qrcode encodes it. */
export function qrMatrix(text: string): QrMatrix {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: ERROR_CORRECTION });
  return Array.from({ length: modules.size }, (_, row) =>
    Array.from({ length: modules.size }, (_, column) => Boolean(modules.get(row, column))),
  );
}

/**
 * Draws the QR code of a text as vector squares: a white square with the quiet zone, then every
 * run of dark modules in a row as one filled rectangle, all in one path, in black.
 * @param x left edge of the quiet zone, points
 * @param y top edge of the quiet zone, points
 * @param module side of one module, points
 * @returns the side of the whole square, quiet zone included, points
 */
export function drawQrCode(
  doc: PDFKit.PDFDocument,
  text: string,
  x: number,
  y: number,
  module: number,
): number {
  const matrix = qrMatrix(text);
  const side = (matrix.length + 2 * QUIET_ZONE_MODULES) * module;
  doc.save();
  doc.rect(x, y, side, side).fillColor('#ffffff').fill();
  const origin = { x: x + QUIET_ZONE_MODULES * module, y: y + QUIET_ZONE_MODULES * module };
  matrix.forEach((row, r) => {
    let start = -1;
    row.forEach((dark, c) => {
      if (dark && start < 0) start = c;
      if (start >= 0 && (!dark || c === row.length - 1)) {
        const end = dark ? c + 1 : c;
        doc.rect(origin.x + start * module, origin.y + r * module, (end - start) * module, module);
        start = -1;
      }
    });
  });
  doc.fillColor('#000000').fill();
  doc.restore();
  return side;
}
