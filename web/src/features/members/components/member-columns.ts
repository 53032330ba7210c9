import { useCallback, useState } from 'react';

/** The Members table's columns, in table order; `mark` is always shown. */
export const MEMBER_COLUMNS = [
  { key: 'mark', label: 'Mark', shown: true, fixed: true },
  { key: 'level', label: 'Level', shown: true },
  { key: 'grid', label: 'Grid', shown: true },
  { key: 'category', label: 'Category', shown: true },
  { key: 'material', label: 'Material', shown: false },
  { key: 'section', label: 'Section', shown: false },
  { key: 'supports', label: 'Supports', shown: false },
  { key: 'spans', label: 'Spans', shown: true },
  { key: 'length', label: 'Length', shown: false },
  { key: 'governingCheck', label: 'Governing check', shown: true },
  { key: 'utilization', label: 'Utilisation', shown: true },
  { key: 'verdict', label: 'Verdict', shown: true },
  { key: 'I', label: 'I', shown: false },
  { key: 'requiredI', label: 'I required', shown: true },
  { key: 'reviewer', label: 'Reviewer', shown: true },
  { key: 'flags', label: 'Open flags', shown: true },
] as const;

export type MemberColumnKey = (typeof MEMBER_COLUMNS)[number]['key'];

export const DEFAULT_COLUMNS: MemberColumnKey[] = MEMBER_COLUMNS.filter((c) => c.shown).map((c) => c.key);

const STORAGE_KEY = 'sagline.members.columns';

/** Known keys in table order, `mark` always first. */
export function normaliseColumns(keys: readonly string[]): MemberColumnKey[] {
  const wanted = new Set([...keys, 'mark']);
  return MEMBER_COLUMNS.map((c) => c.key).filter((k) => wanted.has(k));
}

function readStored(): MemberColumnKey[] {
  try {
    const raw = window.localStorage.getItem(STORAGE_KEY);
    if (!raw) return DEFAULT_COLUMNS;
    const parsed: unknown = JSON.parse(raw);
    return Array.isArray(parsed) && parsed.every((k) => typeof k === 'string') ? normaliseColumns(parsed) : DEFAULT_COLUMNS;
  } catch {
    return DEFAULT_COLUMNS;
  }
}

/**
 * The columns this browser shows. A personal preference, not part of the
 * view's address: a shared link shows the same members, in the reader's
 * own columns.
 */
export function useMemberColumns(): [MemberColumnKey[], (keys: readonly string[]) => void] {
  const [columns, setColumns] = useState<MemberColumnKey[]>(readStored);
  const update = useCallback((keys: readonly string[]) => {
    const next = normaliseColumns(keys);
    setColumns(next);
    try {
      window.localStorage.setItem(STORAGE_KEY, JSON.stringify(next));
    } catch {
      // Storage full or disabled: the choice holds for this visit.
    }
  }, []);
  return [columns, update];
}
