import {
  PIECE_TITLES,
  type MechanismAssessment,
  type MechanismEvidenceInput,
  type MechanismPiece,
  type MechanismPieceKind,
  type MechanismVerdict,
  type MissingPiece,
} from './mechanism-evidence';
import { readMechanismPieces } from './read-mechanism-pieces';

/** What to add for each missing piece (the screen links each to where it is added). */
const TO_ADD: Record<MechanismPieceKind, string> = {
  lifetime: 'Add lifetimes at each [Q] (a decay set, or a lifetime column) to compare τ0/τ with I0/I.',
  temperature: 'Measure the same pair in the same solvent at 3 or more temperatures.',
  wavelength: 'Add emission spectra at each [Q] (a spectrum matrix) to check that K_SV is the same across the band.',
  absorption: 'Add absorption spectra at each [Q] to look for a ground-state complex.',
  diffusion: 'Give τ0 (for kq) and a solvent with a viscosity (for the diffusion limit).',
};

const ORDER: MechanismPieceKind[] = ['lifetime', 'temperature', 'wavelength', 'absorption', 'diffusion'];

/** Pieces that point to a static part: a temperature fall, an absorption change, kq above k_diff. */
const pointsStatic = (piece: MechanismPiece) => piece.reading === 'static' || piece.reading === 'static-or-long-range';

/**
 * The combined verdict on a study's quenching mechanism from whatever evidence exists
 * (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 8, from memory):
 * - a K_SV that changes across the emission, or a new emission growing with [Q], means two
 *   emitters or an exciplex: one K_SV then mixes them, so that verdict comes first;
 * - lifetimes against intensities decide static from dynamic when they say either; evidence that
 *   contradicts them (a static temperature trend against equal slopes, a dynamic trend against
 *   unchanged lifetimes, an absorption change against equal slopes) makes the verdict unclear,
 *   with the conflict named; kq above k_diff with equal slopes means quenching at long range;
 * - without lifetimes the rest gives a leaning: only static signs → static, only a dynamic
 *   temperature trend → dynamic, both → both, none → unclear; the reasons say lifetimes would decide.
 * Missing pieces are named with what to add.
 *
 * @throws EngineError from readMechanismPieces on estimates that are not numbers
 * @example combineMechanismEvidence({ lifetime: null, temperature: null, wavelength: null, absorption: null, diffusion: null }).verdict // 'unclear'
 */
export function combineMechanismEvidence(input: MechanismEvidenceInput): MechanismAssessment {
  const pieces = readMechanismPieces(input);
  const missing: MissingPiece[] = ORDER.filter((kind) => !pieces.some((piece) => piece.kind === kind)).map((kind) => ({
    kind,
    title: PIECE_TITLES[kind],
    reason: input.missingBecause?.[kind] ?? TO_ADD[kind],
  }));
  const { verdict, reasons } = decide(pieces);
  return { pieces, verdict, reasons, missing };
}

function decide(pieces: MechanismPiece[]): { verdict: MechanismVerdict; reasons: string[] } {
  const find = (kind: MechanismPieceKind) => pieces.find((piece) => piece.kind === kind);
  const others = (kind: MechanismPieceKind) => pieces.filter((piece) => piece.kind !== kind);
  if (pieces.length === 0)
    return {
      verdict: 'unclear',
      reasons: ['No evidence beyond the Stern–Volmer line yet: one line cannot tell how the light goes out.'],
    };

  const wavelength = find('wavelength');
  if (wavelength?.reading === 'two-emitters')
    return {
      verdict: 'two-emitters',
      reasons: [
        wavelength.summary,
        'With two emitters one K_SV averages over them, so the other evidence is read per band, not for the whole study.',
      ],
    };

  const lifetime = find('lifetime');
  if (lifetime && (lifetime.reading === 'dynamic' || lifetime.reading === 'static' || lifetime.reading === 'both')) {
    const decided = lifetime.reading;
    const reasons = [`Lifetimes against intensities decide between static and dynamic: ${lifetime.summary}`];
    const conflicts: string[] = [];
    for (const piece of others('lifetime')) {
      if (piece.reading === 'unclear') continue;
      const against =
        (decided === 'dynamic' && piece.reading === 'static') || (decided === 'static' && piece.reading === 'dynamic');
      if (against) conflicts.push(`But ${piece.summary}`);
      else if (decided === 'dynamic' && piece.reading === 'static-or-long-range')
        reasons.push(
          `${piece.summary} With equal slopes this means quenching at long range (energy transfer, for one), not a complex.`,
        );
      else reasons.push(piece.summary);
    }
    if (conflicts.length > 0)
      return {
        verdict: 'unclear',
        reasons: [reasons[0]!, ...conflicts, 'The evidence disagrees: check both measurements.'],
      };
    return { verdict: decided, reasons };
  }

  const reasons: string[] = [];
  if (lifetime) reasons.push(lifetime.summary);
  const staticSigns = pieces.filter(pointsStatic);
  const dynamicSigns = pieces.filter((piece) => piece.reading === 'dynamic');
  reasons.push(...[...dynamicSigns, ...staticSigns].map((piece) => piece.summary));
  const decideWith = 'Lifetimes against intensities would decide (Stern–Volmer plots of τ0/τ and I0/I).';
  if (staticSigns.length > 0 && dynamicSigns.length > 0)
    return { verdict: 'both', reasons: [...reasons, 'Signs of both a dynamic and a static part.', decideWith] };
  if (staticSigns.length > 0) return { verdict: 'static', reasons: [...reasons, decideWith] };
  if (dynamicSigns.length > 0) return { verdict: 'dynamic', reasons: [...reasons, decideWith] };
  const neutral = pieces.filter((piece) => piece.reading === 'neutral').map((piece) => piece.summary);
  return {
    verdict: 'unclear',
    reasons: [...reasons, ...neutral, 'Nothing here points either way.', decideWith],
  };
}
