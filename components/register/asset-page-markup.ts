import { format } from 'date-fns';
import type { AssetDrawingResult } from '@/lib/drawings/asset-drawing';
import { formatDateOnly } from '@/lib/dates/date-only';
import { SafeHtml, html } from '@/lib/figures/markup';
import { fmt } from '@/lib/format';
import type { SurveyMethod } from '@/entities';
import { DESIGN_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { statusTagHtml } from '@/components/ui/status-tag-markup';
import { tableFrameClassName, type FrameOptions } from '@/components/ui/table-frame';
import { keySwatchMarkup } from '@/components/drawings/drawing-svg';
import { buttonClassName } from '@/components/ui/button';
import { CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, FORECAST_DATE_LABELS, METAL_WORDS, STATUS_LABELS, WATER_TYPE_LABELS, ZONE_KIND_LABELS, inSentence, surveyMethodWords } from '@/lib/labels';
import type { AssetPage, ForecastRow } from '@/lib/server/services/assets/get-asset-page';

/*
 * The asset page's read-only parts as static markup (StaticHtml): the particulars, the forecast table, the history
 * of changes, and the drawing's key, notes and list of groups. Nothing in them changes in the page or takes input;
 * as strings they cost the server a fraction of what the same elements did (the asset page is benchmarked against
 * /api/health, npm run bench). Every value is escaped by `html`.
 */

const TH = 'py-1 text-left font-medium';

/** TableFrame's frame around a table built with `html` (here, not in table-frame.tsx: the client tables import that file). */
export function tableFrameHtml(label: string, table: SafeHtml, options: FrameOptions = {}): SafeHtml {
  return html`<div role="region" aria-label="${label}" tabindex="0" class="${tableFrameClassName(options)}">${table}</div>`;
}

/**
 * The asset's zones. For a member who may change the register each row has an Edit button (the zone's form opens
 * under the table) and an Archive button; both are handled by ZonesTable (zones-table.tsx) through their data
 * attributes, so the rows themselves are static.
 */
export function zonesTableHtml(zones: readonly AssetPage['zones'][number][], canWrite: boolean): SafeHtml {
  const table = html`<table class="w-full text-sm" aria-label="Zones"><thead class="text-xs text-ink-soft"><tr class="border-b border-rule"><th class="${TH}">Zone</th><th class="${TH}">Kind</th><th class="py-1 text-right font-medium">Area m²</th><th class="py-1 pl-3 text-left font-medium">Coating</th><th class="${TH}">Environment</th><th class="${TH}">Depth</th><th><span class="sr-only">Actions</span></th></tr></thead><tbody>${zones.map(
    (z) =>
      html`<tr class="border-b border-rule align-top"><td class="py-1.5">${z.name}${
        canWrite
          ? html`<button type="button" class="mt-1 block cursor-pointer text-xs text-tide-600 hover:underline max-lg:min-h-11" data-zone-edit="${z.id}" aria-expanded="false">Edit<span class="sr-only"> the zone ${z.name}</span></button>`
          : null
      }</td><td class="py-1.5">${ZONE_KIND_LABELS[z.kind] ?? 'Other'}</td><td class="num py-1.5">${fmt(z.areaM2, 1)}</td><td class="py-1.5 pl-3">${COATING_LABELS[z.coatingCategory as keyof typeof COATING_LABELS] ?? z.coatingCategory}${
        z.coatingCategory !== 'bare' && z.coatingAgeYears ? `, ${z.coatingAgeYears} yr old` : ''
      }${z.drainsCurrent ? ` · bare ${METAL_WORDS[z.drainsCurrent]}` : ''}</td><td class="py-1.5">${WATER_TYPE_LABELS[z.waterType]}, ${inSentence(CLIMATE_LABELS[z.climate as keyof typeof CLIMATE_LABELS] ?? '')}</td><td class="py-1.5">${
        DEPTH_BAND_LABELS[z.depthBand as keyof typeof DEPTH_BAND_LABELS] ?? '–'
      }</td><td class="py-1.5 text-right">${
        canWrite
          ? html`<button type="button" class="${buttonClassName('danger', 'text-xs')}" data-zone-archive="${z.id}" data-zone-name="${z.name}">Archive<span class="sr-only"> the zone ${z.name}</span></button>`
          : null
      }</td></tr>`,
  )}${!zones.length ? html`<tr><td colspan="7" class="py-4 text-center text-ink-faint">No zones recorded.</td></tr>` : null}</tbody></table>`;
  return tableFrameHtml('Zones', table);
}

/** The particulars: label and value pairs, a dash for a value not recorded. */
export function particularsHtml(particulars: readonly [string, string | null | undefined][]): SafeHtml {
  return html`<dl class="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-3">${particulars.map(
    ([label, value]) => html`<div><dt class="text-2xs uppercase tracking-wide text-ink-faint">${label}</dt><dd>${value ?? '—'}</dd></div>`,
  )}</dl>`;
}

/** The forecast by group: installed mass, consumption, basis, the renew-by date and its band, end of life, renewal. */
export function forecastTableHtml(rows: readonly ForecastRow[]): SafeHtml {
  const table = html`<table class="mt-3 w-full min-w-[56rem] text-sm" aria-label="Forecast by group"><thead class="text-xs text-ink-soft"><tr class="border-b border-rule"><th class="${TH}">Group</th><th class="py-1 text-right font-medium">Installed net</th><th class="py-1 text-right font-medium">Consumption</th><th class="py-1 pl-3 text-left font-medium">Basis</th><th class="${TH}">${FORECAST_DATE_LABELS.renewBy}</th><th class="${TH}">${FORECAST_DATE_LABELS.band}</th><th class="py-1 text-left font-medium text-ink-faint">${FORECAST_DATE_LABELS.endOfLife}</th><th class="py-1 pl-3 text-left font-medium">Renewal</th></tr></thead><tbody>${rows.map(
    (r) =>
      html`<tr class="border-b border-rule align-top"><td class="py-1">${r.label}</td><td class="num py-1">${fmt(r.installedNetKg, 1)} kg</td><td class="num py-1">${r.ratePerYearKg === null ? '—' : `${fmt(r.ratePerYearKg, 1)} kg/yr`}</td><td class="py-1 pl-3 text-xs">${r.basis}</td><td class="py-1 font-medium">${r.renewBy ? formatDateOnly(r.renewBy) : r.ratePerYearKg !== null ? 'does not deplete' : '—'}</td><td class="py-1 text-xs">${r.renewByEarly ? `${formatDateOnly(r.renewByEarly, 'MMM yyyy')} – ${r.renewByLate ? formatDateOnly(r.renewByLate, 'MMM yyyy') : 'later'}` : '—'}</td><td class="py-1 text-xs text-ink-soft">${r.endOfLife ? formatDateOnly(r.endOfLife) : '—'}</td><td class="py-1 pl-3">${r.renewal ?? '—'}${r.renewalReason ? html`<span class="block text-xs text-ink-soft">${r.renewalReason}</span>` : null}</td></tr>`,
  )}</tbody></table>`;
  return tableFrameHtml('Forecast by group', table);
}

export interface GroupChange {
  id: string;
  createdAt: Date;
  changedByEmail: string | null;
  changes: Record<string, [unknown, unknown]>;
  group: { label: string };
}

/** The latest changes to the groups, newest first, in a closed disclosure. */
export function changesHtml(changes: readonly GroupChange[]): SafeHtml {
  return html`<details class="mt-3 text-xs text-ink-soft"><summary class="cursor-pointer">History of changes (${changes.length} latest)</summary><ul class="mt-1 flex flex-col gap-0.5">${changes.map(
    (c) =>
      html`<li>${format(c.createdAt, 'd MMM yyyy HH:mm')} · ${c.group.label} · ${c.changedByEmail}: ${Object.entries(c.changes)
        .map(([field, [from, to]]) => `${field} ${String(from ?? '—')} → ${String(to ?? '—')}`)
        .join('; ')}</li>`,
  )}</ul></details>`;
}

type Drawing = NonNullable<AssetDrawingResult['drawing']>;

/** The drawing's key (each swatch beside its words), its notes, and the text alternative: every group in words. */
export function drawingListHtml(d: Drawing, listId: string): SafeHtml {
  const key = html`<ul class="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Key to the drawing">${d.key.map(
    (k) => html`<li class="flex items-center gap-1.5"><svg width="22" height="12" viewBox="0 0 22 12" aria-hidden="true" class="dw inline-block shrink-0 align-middle">${new SafeHtml(keySwatchMarkup(k.role))}</svg>${k.label}</li>`,
  )}</ul>`;
  const notes = d.notes.map((n) => html`<p class="text-xs text-ink-soft">${n}</p>`);
  const notDrawn = `Not on the drawing: the position names no ${d.kind === 'hull' ? 'frames or part of the hull' : 'pile, bent or row'}.`;
  const table = html`<table id="${listId}" class="w-full text-sm" aria-label="Anode groups on the drawing"><thead class="text-xs text-ink-soft"><tr class="border-b border-rule"><th class="${TH}">Group</th><th class="${TH}">Where</th><th class="py-1 text-right font-medium">Anodes</th><th class="py-1 pl-3 pr-3 text-left font-medium">Left today (forecast)</th><th class="${TH}">Latest readings</th></tr></thead><tbody>${d.rows.map(
    (r) =>
      html`<tr id="drawing-group-${r.id}" class="scroll-mt-24 border-b border-rule align-top target:bg-paper-sunk target:outline target:outline-2 target:outline-ink-soft"><th scope="row" class="py-1 text-left font-medium">${r.label}</th><td class="py-1">${r.where}${r.note ? html`<span class="block text-xs text-ink-soft">${r.note}</span>` : null}${!r.drawn ? html`<span class="block text-xs text-ink-soft">${notDrawn}</span>` : null}</td><td class="num py-1">${r.count}</td><td class="whitespace-nowrap py-1 pl-3 pr-3">${r.remaining}</td><td class="py-1 text-xs">${r.readings ?? '—'}</td></tr>`,
  )}${!d.rows.length ? html`<tr><td colspan="5" class="py-3 text-center text-ink-faint">No anode groups fitted.</td></tr>` : null}</tbody></table>`;
  // Readings at no group are drawn on the views (an image): in words here as well.
  const others = d.otherReadings.length ? html`<p class="text-xs text-ink-soft">Readings of the latest survey at no group: ${d.otherReadings.join('; ')}.</p>` : null;
  return html`${key}${notes}${tableFrameHtml('Anode groups on the drawing', table)}${others}`;
}

const LINK = 'text-tide-600 hover:underline';

/** The asset's design revisions, newest first, each a link with who prepared it and its status. */
export function designsHtml(org: string, designs: readonly { id: string; revision: number; title: string; status: string; preparedBy: { name: string } }[], deskLink: boolean): SafeHtml {
  const list = designs.length
    ? html`<ul class="divide-y divide-rule text-sm">${designs.map(
        (d) =>
          html`<li class="flex items-center justify-between gap-3 py-1.5"><a href="/o/${org}/designs/${d.id}" class="${LINK}">Rev. ${d.revision}: ${d.title}</a><span class="flex items-center gap-2 text-xs text-ink-soft">${d.preparedBy.name}${statusTagHtml(toneOf(DESIGN_STATUS_TONES, d.status), STATUS_LABELS[d.status as keyof typeof STATUS_LABELS] ?? d.status)}</span></li>`,
      )}</ul>`
    : html`<p class="text-sm text-ink-faint">No designs yet.</p>`;
  return html`${list}${deskLink ? html`<a href="/o/${org}/designs" class="mt-2 inline-block text-sm text-tide-600 underline">Open a new design on the design desk</a>` : null}`;
}

/** The asset's latest surveys, newest first, each a link with its method and surveyor. */
export function surveysHtml(org: string, surveys: readonly { id: string; surveyedOn: string; method: SurveyMethod; surveyor: string | null }[]): SafeHtml {
  if (!surveys.length) return html`<p class="text-sm text-ink-faint">No surveys yet.</p>`;
  return html`<ul class="divide-y divide-rule text-sm">${surveys.map(
    (s) => html`<li class="flex items-center justify-between py-1.5"><a href="/o/${org}/surveys/${s.id}" class="${LINK}">${formatDateOnly(s.surveyedOn)}: ${surveyMethodWords(s.method)}${s.surveyor ? ` by ${s.surveyor}` : ''}</a></li>`,
  )}</ul>`;
}
