import { combinationName, describeSource, findCategory, VERDICT_CAUTION } from '@sagline/common/limits';
import type { ProjectLimitSet as ProjectLimitSetResponse } from '@sagline/common/api-types';
import type { LimitSetRow } from './limit-sets.repository';

export function toProjectLimitSetResponse(row: LimitSetRow): ProjectLimitSetResponse {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    sourcePresetId: row.source_preset_id,
    categories: row.categories.map((id) => {
      const c = findCategory(id);
      return { id, label: c?.label ?? id, description: c?.description ?? '' };
    }),
    rules: row.rules.map((r) => ({
      id: r.id,
      category: r.category,
      check: r.check,
      combination: r.combination,
      combinationName: combinationName(r.combination),
      ratio: r.ratio,
      maxAbs: r.maxAbs,
      plus: r.plus,
      materials: r.materials,
      lengthRange: r.lengthRange,
      source: r.source,
      sourceText: describeSource(r.source),
    })),
    notes: row.notes.map((n) => ({ text: n.text, sourceText: describeSource(n.source) })),
    caution: VERDICT_CAUTION,
    updatedAt: row.updated_at.toISOString(),
  };
}
