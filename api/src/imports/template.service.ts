import { Injectable } from '@nestjs/common';
import { findCategory } from '@sagline/common/limits';
import { LimitSetsService } from '../checks/limit-sets.service';
import { notFound } from '../common/api-error';
import { exampleSchedule } from './example-schedule';
import { ImportsRepository } from './imports.repository';
import { scheduleWorkbook } from './template-workbook';

/** The blank template and the filled example, in the project's unit system, levels and limit-set categories. */
@Injectable()
export class TemplateService {
  constructor(
    private readonly projects: ImportsRepository,
    private readonly limitSets: LimitSetsService,
  ) {}

  async workbook(projectId: number, filled: boolean): Promise<{ fileName: string; bytes: Buffer }> {
    const context = await this.projects.projectContext(projectId);
    if (!context) throw notFound(`Project ${projectId} was not found, or you are not on its team.`);
    const { set } = await this.limitSets.forProject(projectId);
    const categoryLabels = Object.fromEntries(set.categories.map((c) => [c, findCategory(c)?.label ?? 'limit-set category']));
    const base = context.name.replace(/[^A-Za-z0-9 _-]+/g, '').trim().replace(/\s+/g, '-').toLowerCase() || 'project';
    if (!filled) {
      const bytes = await scheduleWorkbook({ unitSystem: context.unitSystem, categories: set.categories, categoryLabels, title: `${context.name}: member schedule template` });
      return { fileName: `${base}-member-schedule-template.xlsx`, bytes };
    }
    const pick = (wanted: string[]) => wanted.find((c) => set.categories.includes(c)) ?? set.categories[0] ?? 'floor';
    const levels = context.levels.length
      ? { low: context.levels[Math.min(1, context.levels.length - 1)].name, high: context.levels[context.levels.length - 1].name }
      : { low: 'L2', high: 'Roof' };
    const { members, loads } = exampleSchedule(context.unitSystem, levels, { floor: pick(['floor']), roof: pick(['roof-no-ceiling', 'roof-nonplaster-ceiling', 'floor']) });
    const bytes = await scheduleWorkbook({
      unitSystem: context.unitSystem,
      categories: set.categories,
      categoryLabels,
      title: `${context.name}: example member schedule (invented members, for illustration)`,
      members,
      loads,
    });
    return { fileName: `${base}-member-schedule-example.xlsx`, bytes };
  }
}
