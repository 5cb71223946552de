import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import { AppError } from '../lib/app-error';

// zxcvbn's estimate against its shipped lists of common passwords, names and keyboard patterns.
// Score 3 ("safely unguessable", about 10^8 to 10^10 guesses) is the least we accept.
const estimator = new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });
const leastScore = 3;

const reasons: Record<string, string> = {
  topTen: 'it is one of the most used passwords',
  topHundred: 'it is one of the most used passwords',
  common: 'it is a commonly used password',
  similarToCommon: 'it is a small change to a commonly used password',
  straightRow: 'it is a row of keys on the keyboard',
  keyPattern: 'it is a keyboard pattern',
  simpleRepeat: 'it repeats a few characters',
  extendedRepeat: 'it repeats a short pattern',
  sequences: 'it is a simple sequence',
  recentYears: 'it is built on a recent year',
  dates: 'it is built on a date',
  userInputs: 'it is built on your name or e-mail address',
  namesByThemselves: 'it is built on common names',
  commonNames: 'it is built on common names',
};

/**
 * Refuses a new password that is easy to guess: a common password or close to one, a keyboard
 * run, a repeat or sequence, or one built on the person's own name or address. Throws a 400
 * that names the field; the length rule lives in the shared zod schema.
 */
export function assertStrongPassword(password: string, field: string, personal: string[] = []): void {
  const result = estimator.check(
    password,
    personal.flatMap((value) => [value, ...value.split(/[@.\s_-]+/)]),
  );
  if (result.score >= leastScore) return;
  const reason = reasons[result.feedback.warning ?? ''] ?? 'it would be guessed quickly';
  const message = `is too easy to guess: ${reason}. Choose a longer phrase of unrelated words`;
  throw new AppError('weak_password', `The password ${message}.`, 400, [{ path: field, message }]);
}
