import { formatEstimate, formatNumber } from '@shared/format';
import {
  MECHANISM_READING_WORDS,
  MECHANISM_VERDICT_WORDS,
  type MechanismPieceAnswer,
} from '@shared/schemas/mechanism-evidence';
import type { LabContext } from '../../domain/lab-context';
import { mechanismEvidence } from '../mechanism/mechanism-evidence.service';
import { facts, heading, muted, ink, type Pdf } from './pdf-document';

const numberText = (number: MechanismPieceAnswer['numbers'][number]) =>
  `${number.label} ${
    number.standardError === null
      ? `${formatNumber(number.value)}${number.unit ? ` ${number.unit}` : ''}`
      : formatEstimate(number.value, number.standardError, number.unit)
  }`;

/**
 * The study's mechanism evidence as on the screen's Mechanism panel: the combined verdict with its
 * reasons, each piece with what it says and its numbers, and the pieces still missing.
 */
export async function mechanismSection(doc: Pdf, lab: LabContext, studyId: string): Promise<void> {
  const evidence = await mechanismEvidence(lab, studyId);
  heading(doc, 'Mechanism');
  facts(doc, [['Combined verdict', MECHANISM_VERDICT_WORDS[evidence.verdict]]]);
  evidence.reasons.forEach((reason) => doc.fontSize(9).text(`• ${reason}`, { indent: 8 }));
  for (const piece of evidence.pieces) {
    doc.moveDown(0.3);
    doc.font('Lato-Bold').fontSize(10).fillColor(ink).text(`${piece.title}: ${MECHANISM_READING_WORDS[piece.reading]}`);
    doc.font('Lato').fontSize(9).text(piece.summary);
    if (piece.numbers.length > 0) doc.fillColor(muted).text(piece.numbers.map(numberText).join('; ')).fillColor(ink);
  }
  if (evidence.missing.length > 0) {
    doc.moveDown(0.3);
    evidence.missing.forEach((piece) => doc.fontSize(9).text(`Not yet measured: ${piece.title}. ${piece.reason}`));
  }
  doc.fontSize(10);
}
