import type { ShiPicture } from '../../shared/labels/safe-handling-text.ts';

/**
 * The pictures beside the safe handling statements, drawn as plain vector lines of our own (the
 * regulation asks for "a graphic illustration" of each; these copy no published image): a
 * refrigerator, hands under a faucet with soap bubbles, a skillet, a thermometer. Each fills a
 * square of side `s` with its top left corner at (x, y), in one colour.
 */
export function drawPicture(
  doc: PDFKit.PDFDocument,
  picture: ShiPicture,
  x: number,
  y: number,
  s: number,
  color: string,
): void {
  doc
    .save()
    .lineWidth(Math.max(0.6, s / 24))
    .strokeColor(color)
    .fillColor(color);
  DRAW[picture](doc, x, y, s);
  doc.restore();
}

type Draw = (doc: PDFKit.PDFDocument, x: number, y: number, s: number) => void;

const DRAW: Readonly<Record<ShiPicture, Draw>> = {
  // A tall cabinet, the freezer door above the fridge door, a handle on each.
  refrigerator: (doc, x, y, s) => {
    const w = s * 0.56;
    const left = x + (s - w) / 2;
    doc.roundedRect(left, y + s * 0.04, w, s * 0.92, s * 0.06).stroke();
    doc
      .moveTo(left, y + s * 0.36)
      .lineTo(left + w, y + s * 0.36)
      .stroke();
    doc
      .moveTo(left + w * 0.18, y + s * 0.14)
      .lineTo(left + w * 0.18, y + s * 0.28)
      .stroke();
    doc
      .moveTo(left + w * 0.18, y + s * 0.46)
      .lineTo(left + w * 0.18, y + s * 0.66)
      .stroke();
  },
  // A faucet running into two cupped hands, with soap bubbles beside them.
  hands: (doc, x, y, s) => {
    doc
      .moveTo(x + s * 0.1, y + s * 0.1)
      .lineTo(x + s * 0.5, y + s * 0.1)
      .quadraticCurveTo(x + s * 0.58, y + s * 0.1, x + s * 0.58, y + s * 0.2)
      .lineTo(x + s * 0.58, y + s * 0.26)
      .stroke();
    for (const at of [0.34, 0.44]) doc.circle(x + s * 0.58, y + s * at, s * 0.025).fill();
    // The two hands, cupped side by side: each a bowl with its thumb's curl at the top.
    for (const left of [0.16, 0.52]) {
      doc
        .moveTo(x + s * left, y + s * 0.58)
        .quadraticCurveTo(x + s * (left + 0.16), y + s * 0.98, x + s * (left + 0.32), y + s * 0.58)
        .stroke();
      doc
        .moveTo(x + s * left, y + s * 0.58)
        .lineTo(x + s * (left + 0.32), y + s * 0.58)
        .stroke();
    }
    doc.circle(x + s * 0.12, y + s * 0.4, s * 0.05).stroke();
    doc.circle(x + s * 0.88, y + s * 0.42, s * 0.06).stroke();
    doc.circle(x + s * 0.8, y + s * 0.28, s * 0.04).stroke();
  },
  // A round pan seen from above, its long handle to the right.
  skillet: (doc, x, y, s) => {
    const r = s * 0.28;
    const cx = x + s * 0.36;
    const cy = y + s * 0.55;
    doc.circle(cx, cy, r).stroke();
    doc.circle(cx, cy, r * 0.72).stroke();
    doc.roundedRect(cx + r, cy - s * 0.04, s * 0.34, s * 0.08, s * 0.03).fill();
  },
  // A stem thermometer: the bulb at the foot, the column and three marks.
  thermometer: (doc, x, y, s) => {
    const cx = x + s * 0.5;
    doc.roundedRect(cx - s * 0.07, y + s * 0.06, s * 0.14, s * 0.66, s * 0.07).stroke();
    doc.circle(cx, y + s * 0.8, s * 0.13).fill();
    doc.rect(cx - s * 0.025, y + s * 0.38, s * 0.05, s * 0.36).fill();
    for (const at of [0.2, 0.32, 0.44]) {
      doc
        .moveTo(cx + s * 0.1, y + s * at)
        .lineTo(cx + s * 0.2, y + s * at)
        .stroke();
    }
  },
};
