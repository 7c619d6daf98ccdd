'use client';
import { Disclosure } from '@/components/ui/disclosure';
import { TableFrame } from '@/components/ui/table-frame';
import { ArchiveZoneButton } from './archive-zone-button';
import { ZoneForm } from './lazy-forms';
import { CLIMATE_LABELS, COATING_LABELS, DEPTH_BAND_LABELS, METAL_WORDS, WATER_TYPE_LABELS, ZONE_KIND_LABELS, inSentence } from '@/lib/labels';
import { fmt } from '@/lib/format';
import type { AssetPage } from '@/lib/server/services/assets/get-asset-page';

/** A zone as the asset page reads it (getAssetPage) and its edit form takes it. */
export type ZoneRow = AssetPage['zones'][number];

/**
 * The asset's zones, each row with its edit form (opened in place) and its archive button for a member who may
 * change the register. One client component for the table: the server sends the rows once, as data, rather than
 * every cell as an element of the page (the asset page is benchmarked, npm run bench).
 */
export function ZonesTable({ org, assetId, zones, canWrite }: { org: string; assetId: string; zones: ZoneRow[]; canWrite: boolean }) {
  return (
    <TableFrame label="Zones">
      <table className="w-full text-sm" aria-label="Zones">
        <thead className="text-xs text-ink-soft">
          <tr className="border-b border-rule">
            <th className="py-1 text-left font-medium">Zone</th>
            <th className="py-1 text-left font-medium">Kind</th>
            <th className="py-1 text-right font-medium">Area m²</th>
            <th className="py-1 pl-3 text-left font-medium">Coating</th>
            <th className="py-1 text-left font-medium">Environment</th>
            <th className="py-1 text-left font-medium">Depth</th>
            <th>
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {zones.map((z) => (
            <tr key={z.id} className="border-b border-rule align-top">
              <td className="py-1.5">
                {z.name}
                {canWrite ? (
                  <Disclosure className="mt-1" summaryClassName="cursor-pointer text-xs text-tide-600" summary="Edit">
                    <div className="mt-2 rounded-[3px] border border-rule bg-paper p-3">
                      <ZoneForm org={org} assetId={assetId} zone={z} />
                    </div>
                  </Disclosure>
                ) : null}
              </td>
              <td className="py-1.5">{ZONE_KIND_LABELS[z.kind] ?? 'Other'}</td>
              <td className="num py-1.5">{fmt(z.areaM2, 1)}</td>
              <td className="py-1.5 pl-3">
                {COATING_LABELS[z.coatingCategory as keyof typeof COATING_LABELS] ?? z.coatingCategory}
                {z.coatingCategory !== 'bare' && z.coatingAgeYears ? `, ${z.coatingAgeYears} yr old` : ''}
                {z.drainsCurrent ? ` · bare ${METAL_WORDS[z.drainsCurrent]}` : ''}
              </td>
              <td className="py-1.5">
                {WATER_TYPE_LABELS[z.waterType]}, {inSentence(CLIMATE_LABELS[z.climate as keyof typeof CLIMATE_LABELS] ?? '')}
              </td>
              <td className="py-1.5">{DEPTH_BAND_LABELS[z.depthBand as keyof typeof DEPTH_BAND_LABELS] ?? '–'}</td>
              <td className="py-1.5 text-right">{canWrite ? <ArchiveZoneButton org={org} assetId={assetId} zoneId={z.id} name={z.name} /> : null}</td>
            </tr>
          ))}
          {!zones.length ? (
            <tr>
              <td colSpan={7} className="py-4 text-center text-ink-faint">
                No zones recorded.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </TableFrame>
  );
}
