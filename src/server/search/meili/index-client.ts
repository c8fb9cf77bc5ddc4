// Our one way into a Meilisearch server: the client, index set-up, and document changes that wait for their tasks.
import { Meilisearch, type Index, type IndexSwap, type Task } from 'meilisearch';
import type { WordFamily } from '@/lib/search/word-families';
import { indexSettings, MEILI_INDEX } from './settings';
import type { MeiliFixDocument } from './documents';

export interface MeiliConnection {
  url: string;
  key?: string;
  /** Index name; tests use one of their own. */
  index?: string;
}

/** How long one task may take before the sync job fails and is retried. */
const TASK_TIMEOUT_MS = 30_000;

export class MeiliIndex {
  readonly client: Meilisearch;
  readonly uid: string;

  constructor(readonly connection: MeiliConnection) {
    this.client = new Meilisearch({ host: connection.url, apiKey: connection.key, timeout: 10_000 });
    this.uid = connection.index ?? MEILI_INDEX;
  }

  get index(): Index<MeiliFixDocument> {
    return this.client.index<MeiliFixDocument>(this.uid);
  }

  /** Creates the index when missing and applies our settings; safe to run again. */
  async prepare(families: readonly WordFamily[]): Promise<void> {
    const created = await this.client.createIndex(this.uid, { primaryKey: 'id' }).waitTask({ timeout: TASK_TIMEOUT_MS });
    if (created.status === 'failed' && created.error?.code !== 'index_already_exists') throw taskError(created);
    expectSucceeded(await this.index.updateSettings(indexSettings(families)).waitTask({ timeout: TASK_TIMEOUT_MS }));
  }

  async updateSynonyms(families: readonly WordFamily[]): Promise<void> {
    const synonyms = indexSettings(families).synonyms ?? {};
    expectSucceeded(await this.index.updateSynonyms(synonyms).waitTask({ timeout: TASK_TIMEOUT_MS }));
  }

  /** Upserts the documents and deletes the ids, waiting until Meilisearch has applied both. */
  async apply(documents: MeiliFixDocument[], removedIds: number[]): Promise<void> {
    if (documents.length)
      expectSucceeded(await this.index.addDocuments(documents, { primaryKey: 'id' }).waitTask({ timeout: TASK_TIMEOUT_MS }));
    if (removedIds.length) expectSucceeded(await this.index.deleteDocuments(removedIds).waitTask({ timeout: TASK_TIMEOUT_MS }));
  }

  async clear(): Promise<void> {
    expectSucceeded(await this.index.deleteAllDocuments().waitTask({ timeout: TASK_TIMEOUT_MS }));
  }

  /** Swaps this index's contents with another's in one step, so readers never see a half-built index. */
  async swapWith(other: MeiliIndex): Promise<void> {
    // Sent without the newer "rename" field, which older servers refuse as unknown.
    const swap = { indexes: [this.uid, other.uid] } as unknown as IndexSwap;
    expectSucceeded(await this.client.swapIndexes([swap]).waitTask({ timeout: TASK_TIMEOUT_MS }));
  }

  /** Deletes the index if it exists. */
  async drop(): Promise<void> {
    const task = await this.client.deleteIndex(this.uid).waitTask({ timeout: TASK_TIMEOUT_MS });
    if (task.status === 'failed' && task.error?.code !== 'index_not_found') throw taskError(task);
  }
}

function taskError(task: Task): Error {
  return new Error(`Meilisearch task ${task.uid} (${task.type}) failed: ${task.error?.code ?? 'unknown'}: ${task.error?.message ?? ''}`);
}

function expectSucceeded(task: Task): void {
  if (task.status !== 'succeeded') throw taskError(task);
}
