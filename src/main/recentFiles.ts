/**
 * The recent-files list: most recent first, no duplicates, at most `MAX_RECENT` entries,
 * kept as JSON in the user's data folder.
 */
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { z } from 'zod';
import { writeFileAtomic } from '../shared/atomicWrite.ts';
import type { RecentFile } from '../shared/hostApi.ts';

export const MAX_RECENT = 8;

const recentListSchema = z.array(z.object({ name: z.string(), path: z.string() }));

/** The list with `path` moved (or added) to the front. */
export function withRecent(list: readonly RecentFile[], path: string): RecentFile[] {
  return [{ name: basename(path), path }, ...list.filter((r) => r.path !== path)].slice(0, MAX_RECENT);
}

export function withoutRecent(list: readonly RecentFile[], path: string): RecentFile[] {
  return list.filter((r) => r.path !== path);
}

/** Reads the stored list; a missing or damaged file gives an empty list. */
export async function loadRecent(storePath: string): Promise<RecentFile[]> {
  try {
    const parsed = recentListSchema.safeParse(JSON.parse(await readFile(storePath, 'utf8')));
    return parsed.success ? parsed.data.slice(0, MAX_RECENT) : [];
  } catch {
    return [];
  }
}

export async function storeRecent(storePath: string, list: readonly RecentFile[]): Promise<void> {
  await writeFileAtomic(storePath, JSON.stringify(list, null, 2));
}
