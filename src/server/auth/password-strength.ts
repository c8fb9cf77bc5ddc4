// Refuses passwords that are easy to guess (zxcvbn score below 3), with zxcvbn's own advice as the message.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as english from '@zxcvbn-ts/language-en';

/** zxcvbn's scale: 3 is "safely unguessable: moderate protection from offline slow-hash attacks". */
export const MIN_PASSWORD_SCORE = 3;

let factory: ZxcvbnFactory | undefined;

function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...english.dictionary },
    graphs: common.adjacencyGraphs,
    translations: english.translations,
  });
  return factory;
}

/** Messages for a weak password, or an empty list when it is strong enough. */
export function passwordWeaknesses(password: string, userInputs: string[] = []): string[] {
  // Parts of the name and address are the first guesses an attacker makes.
  const inputs = userInputs.flatMap((value) => value.toLowerCase().split(/[^a-z0-9]+/)).filter((part) => part.length >= 3);
  const result = estimator().check(password, [...inputs, 'benchlore']);
  if (result.score >= MIN_PASSWORD_SCORE) return [];
  const advice = [result.feedback.warning, ...result.feedback.suggestions].filter((line): line is string => Boolean(line));
  return ['This password would be easy to guess.', ...advice];
}
