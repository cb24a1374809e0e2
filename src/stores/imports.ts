// Imports and downloads (docs/contracts.md §Imports): check a CSV file against the building (preview and problems by
// row), apply the checked file, download results and the loads template, and search the building's
// own sections beside the catalogue.
import { computed, ref } from 'vue';
import { defineStore, getActivePinia } from 'pinia';
import { z } from 'zod';
import { importProblemSchema, type ImportProblem } from '@shared/schema/imports.ts';
import { ApiError } from '@/api/http.ts';
import { fetchFile, saveBlob } from '@/api/download.ts';
import {
  applyImport,
  checkImport,
  importPreviewSchema,
  searchCompanySections,
  type ImportKind,
  type ImportPreview,
} from '@/api/imports.ts';
import { searchSections as searchCatalogue, type SectionHit } from '@/api/sections.ts';
import { useBuildingsStore } from './buildings.ts';
import { describeError, useNotifyStore } from './notify.ts';
import { useStackStore } from './stack.ts';

export type { ImportKind };
export type ImportState = 'idle' | 'checking' | 'checked' | 'applying' | 'applied';
type Preview = ImportPreview;

const tooLargeSchema = z.object({ problems: z.array(importProblemSchema) });

export const useImportsStore = defineStore('imports', () => {
  const notify = useNotifyStore();

  const buildingId = ref<number | null>(null);
  const kind = ref<ImportKind>('loads');
  const file = ref<File | null>(null);
  const preview = ref<Preview | null>(null);
  const problems = ref<ImportProblem[]>([]);
  const state = ref<ImportState>('idle');
  /** A failure that is not about a row: the file too large, a stale preview, the network. */
  const failure = ref('');

  const canApply = computed(
    () => state.value === 'checked' && problems.value.length === 0 && (preview.value?.changes.length ?? 0) > 0,
  );

  function reset(forBuilding: number, forKind: ImportKind): void {
    buildingId.value = forBuilding;
    kind.value = forKind;
    file.value = null;
    preview.value = null;
    problems.value = [];
    failure.value = '';
    state.value = 'idle';
  }

  function form(extra: Record<string, string> = {}): FormData {
    const body = new FormData();
    for (const [k, v] of Object.entries(extra)) body.append(k, v);
    if (file.value) body.append('file', file.value, file.value.name);
    return body;
  }

  /** A 422 carries the preview with its problems; a 413 carries one problem; anything else is a failure. */
  function takeError(e: unknown): void {
    if (e instanceof ApiError && e.status === 422) {
      const parsed = importPreviewSchema.safeParse(e.details);
      if (parsed.success) {
        preview.value = parsed.data;
        problems.value = parsed.data.problems;
        state.value = 'checked';
        return;
      }
    }
    if (e instanceof ApiError && e.status === 413) {
      const parsed = tooLargeSchema.safeParse(e.details);
      problems.value = parsed.success ? parsed.data.problems : [];
    }
    failure.value = describeError(e);
    state.value = 'idle';
  }

  async function check(picked: File | null): Promise<void> {
    file.value = picked;
    preview.value = null;
    problems.value = [];
    failure.value = '';
    const building = buildingId.value;
    if (!picked || building === null) return void (state.value = 'idle');
    state.value = 'checking';
    try {
      const checked = await checkImport(building, kind.value, form());
      preview.value = checked;
      problems.value = checked.problems;
      state.value = 'checked';
    } catch (e) {
      takeError(e);
    }
  }

  /** Applies the checked file; the server refuses (409) when a stack moved on since the check. */
  async function apply(): Promise<boolean> {
    const checked = preview.value;
    const building = buildingId.value;
    if (!canApply.value || !checked || building === null) return false;
    state.value = 'applying';
    const fields: Record<string, string> = { fileHash: checked.fileHash };
    if (checked.kind === 'loads') fields.basis = JSON.stringify(checked.basis);
    try {
      const result = await applyImport(building, kind.value, form(fields));
      state.value = 'applied';
      const what = kind.value === 'loads' ? 'level load' : 'section';
      notify.success(
        `Imported ${result.applied} ${what}${result.applied === 1 ? '' : 's'}; ${result.stacks.length} stack${result.stacks.length === 1 ? '' : 's'} re-analysed`,
      );
      return true;
    } catch (e) {
      takeError(e);
      if (e instanceof ApiError && e.status === 409)
        failure.value = `${e.message}. Check the file again before importing.`;
      return false;
    }
  }

  /** Saves a download (results, template) under fileName; failures go to the notifier. */
  async function download(apiPath: string, fileName: string): Promise<boolean> {
    try {
      const file = await fetchFile(apiPath);
      saveBlob(file.blob, fileName);
      return true;
    } catch (e) {
      notify.error(e, 'Download failed');
      return false;
    }
  }

  /** The building's own sections matching q, then the catalogue's, for the section pickers. */
  async function searchSections(q: string, series?: string, forBuilding?: number | null): Promise<SectionHit[]> {
    if (!forBuilding || (series && series !== 'Company')) return searchCatalogue(q, series);
    const [own, catalogue] = await Promise.all([
      searchCompanySections(forBuilding, q),
      series === 'Company' ? [] : searchCatalogue(q),
    ]);
    const hits: SectionHit[] = own.map((h) => ({
      designation: h.designation,
      series: h.series,
      massPerMetre: h.massPerMetre,
    }));
    return [...hits, ...catalogue];
  }

  return {
    buildingId,
    kind,
    file,
    preview,
    problems,
    state,
    failure,
    canApply,
    reset,
    check,
    apply,
    download,
    searchSections,
  };
});

/** The section pickers of the building page: the open building's own sections, then the catalogue. */
export function searchBuildingSections(q: string, series?: string): Promise<SectionHit[]> {
  // A picker mounted on its own (without the app's stores) searches the catalogue only.
  if (!getActivePinia()) return searchCatalogue(q, series);
  return useImportsStore().searchSections(q, series, useBuildingsStore().current?.id);
}

/** The section picker of the stack editor: the stack's building's own sections, then the catalogue. */
export function searchStackSections(q: string, series?: string): Promise<SectionHit[]> {
  if (!getActivePinia()) return searchCatalogue(q, series);
  return useImportsStore().searchSections(q, series, useStackStore().buildingId);
}
