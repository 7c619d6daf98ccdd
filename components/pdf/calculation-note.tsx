import { Document, Page, Text, View } from '@react-pdf/renderer';
import { format } from 'date-fns';
import type { AnodeModelSnapshot, StoredDesignResult, StoredInputs } from '@/lib/schemas/design-record';
import { ALLOY_LABELS, CLIMATE_LABELS, COATING_LABELS, CRITERION_LABELS, DEPTH_BAND_LABELS, METAL_LABELS, MOUNTING_LABELS, STATUS_LABELS, WATER_LABELS } from '@/lib/design/labels';
import { fmt, fmtSig } from '@/lib/format';
import { CAUTION_TEXT, PdfTable, pdf } from './pdf-kit';

export interface CalculationNoteData {
  organisation: string;
  asset: { name: string; kind: string; particulars: [string, string][] };
  design: { title: string; revision: number; status: string; appVersion: string; basedOnRevision: number | null };
  inputs: StoredInputs;
  /** Null when the revision was stored without a model snapshot: the note says so and substitutes nothing. */
  model: AnodeModelSnapshot | null;
  /** Whether the results are the revision's stored record (signed revisions) or recomputed at printing (drafts). */
  source: 'stored' | 'recomputed';
  result: StoredDesignResult | null;
  resultError: string | null;
  notices: { code: string; message: string }[];
  signatures: { role: string; name: string | null; at: Date | null }[];
  printedAt: Date;
  printedBy: string;
}

const EQUATIONS = [
  ['Current demand of a surface', 'Ic = Ac · fc · ic', 'DNV-RP-B401 (2010) sec. 7'],
  ['Coating breakdown factor', 'fc = a + b·t; fci = a, fcm = a + b·tf/2, fcf = a + b·tf (at most 1)', 'DNV-RP-B401 (2010) sec. 7'],
  ['Net anode mass', 'M = Icm · tf · 8760 / (u · ε)', 'DNV-RP-B401 (2010) sec. 7'],
  ['Anode current output', 'Ia = (Ec - Ea) / Ra', 'DNV-RP-B401 (2010) sec. 7'],
  ['Resistance, long slender stand-off', 'Ra = ρ/(2πL) · (ln(4L/r) - 1)', 'DNV-RP-B401 (2010) Table 10-7 (modified Dwight)'],
  ['Resistance, long flush', 'Ra = ρ/(2S), S = (L + W)/2', 'DNV-RP-B401 (2010) Table 10-7'],
  ['Resistance, short flush and bracelet', 'Ra = 0.315 ρ / sqrt(A)', 'DNV-RP-B401 (2010) Table 10-7 (McCoy)'],
  ['Count', 'N·m >= M; N·Iai >= Ici; N·Iaf >= Icf', 'DNV-RP-B401 (2010) sec. 7'],
];

/** What the note says of the anode model: the stored snapshot, or plainly that there is none. */
function modelLine(model: CalculationNoteData['model'], key: string) {
  if (!model) return `${key}: not recorded with this revision (no model snapshot was stored; the catalogue's current entry is not substituted)`;
  return `${model.designation}: ${ALLOY_LABELS[model.alloy]}, ${MOUNTING_LABELS[model.mounting]}, net ${fmt(model.netMassKg, 1)} kg, gross ${fmt(model.grossMassKg, 1)} kg`;
}

/** The calculation note: inputs, equations, results, sources, warnings, revision block and cautions. */
export function CalculationNote({ data }: { data: CalculationNoteData }) {
  const { inputs, result } = data;
  const designation = data.model?.designation ?? `${inputs.anodeModelKey} (model not recorded with this revision)`;
  const footer = `${data.organisation} · ${data.asset.name} · ${data.design.title} · revision ${data.design.revision} (${STATUS_LABELS[data.design.status]})`;
  return (
    <Document title={`Calculation note: ${data.asset.name}, revision ${data.design.revision}`} author="Tidewarden" subject="Sacrificial-anode cathodic protection design">
      <Page size="A4" style={pdf.page}>
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' }}>
          <View>
            <Text style={pdf.small}>{data.organisation}</Text>
            <Text style={pdf.h1}>Calculation note: sacrificial-anode cathodic protection</Text>
            <Text>
              {data.asset.name} ({data.asset.kind}) · {data.design.title}
            </Text>
          </View>
          <View style={{ alignItems: 'flex-end' }}>
            <Text style={{ fontWeight: 600 }}>Revision {data.design.revision} · {STATUS_LABELS[data.design.status]}</Text>
            {data.design.basedOnRevision ? <Text style={pdf.small}>from revision {data.design.basedOnRevision}</Text> : null}
            <Text style={pdf.small}>Tidewarden {data.design.appVersion}</Text>
          </View>
        </View>
        <Text style={pdf.caution}>{CAUTION_TEXT}</Text>

        <Text style={pdf.h2}>1. Asset</Text>
        <PdfTable columns={[{ label: 'Particular', width: 35 }, { label: 'Value', width: 65 }]} rows={data.asset.particulars} />

        <Text style={pdf.h2}>2. Design basis and inputs</Text>
        <PdfTable
          columns={[{ label: 'Input', width: 45 }, { label: 'Value', width: 55 }]}
          rows={[
            ['Design life tf', `${fmt(inputs.designLifeYears, 2)} years`],
            ['Water; temperature band', `${WATER_LABELS[inputs.water]}; ${CLIMATE_LABELS[inputs.climate]}${inputs.temperatureC !== null ? `; ${inputs.temperatureC} °C` : ''}`],
            ['Resistivity ρ', `${fmt(inputs.resistivityOhmM, 3)} Ω·m`],
            ['Protective potential Ec', `${fmt(inputs.protectivePotentialV, 3)} V vs Ag/AgCl/seawater`],
            ['Protected metal', METAL_LABELS[inputs.protectedMetal]],
            ['Hull material', inputs.hullMaterial ?? 'not a hull'],
            ['Interval to next docking', inputs.nextDockingYears ? `${inputs.nextDockingYears} years` : 'not given'],
            ['Anode model', modelLine(data.model, inputs.anodeModelKey)],
          ]}
        />
        <Text style={{ ...pdf.small, marginTop: 6, marginBottom: 2 }}>Zones</Text>
        <PdfTable
          columns={[
            { label: 'Zone', width: 22 },
            { label: 'Area m²', width: 10, align: 'right' },
            { label: 'Area source', width: 14 },
            { label: 'Depth', width: 12 },
            { label: 'Coating', width: 16 },
            { label: 'Age yr', width: 7, align: 'right' },
            { label: 'ic i/m/f mA/m²', width: 19, align: 'right' },
          ]}
          rows={inputs.surfaces.map((s) => [
            s.name + (s.drainsCurrent ? ` (bare ${s.drainsCurrent})` : ''),
            fmt(s.areaM2, 1),
            s.areaSource,
            DEPTH_BAND_LABELS[s.depthBand],
            COATING_LABELS[s.coatingCategory],
            s.coatingCategory === 'bare' ? '–' : fmt(s.coatingAgeYears, 1),
            s.currentDensityOverride ? `${fmt(s.currentDensityOverride.initial, 0)}/${fmt(s.currentDensityOverride.mean, 0)}/${fmt(s.currentDensityOverride.final, 0)} (entered)` : 'DNV table',
          ])}
        />

        <Text style={pdf.h2}>3. Equations</Text>
        <PdfTable columns={[{ label: 'Quantity', width: 30 }, { label: 'Relation', width: 42 }, { label: 'Source', width: 28 }]} rows={EQUATIONS} />
        <Text style={{ ...pdf.small, marginTop: 2 }}>Section and table numbers of DNV-RP-B401 are given from memory; confirm them against the licensed edition.</Text>

        <Text style={pdf.h2}>4. Results</Text>
        <Text style={{ ...pdf.small, marginBottom: 4 }}>
          {data.source === 'stored'
            ? `As stored with revision ${data.design.revision} (Tidewarden ${data.design.appVersion}); not recomputed.`
            : "Recomputed from the draft's inputs at printing; a signed revision prints its stored results."}
        </Text>
        {result ? (
          <View>
            <Text style={{ fontSize: 11, fontWeight: 700, marginBottom: 4 }}>
              {result.anodesToFit} anodes of {designation} to fit (at least {result.anodeCount} by the governing criterion: {CRITERION_LABELS[result.governingCriterion]})
            </Text>
            <PdfTable
              columns={[{ label: 'Criterion', width: 50 }, { label: 'Exact', width: 25, align: 'right' }, { label: 'Count', width: 25, align: 'right' }]}
              rows={[
                ['Net anode mass (N·m >= M)', fmt(result.exactCountBy.mass, 2), result.countBy.mass],
                ['Initial current (N·Iai >= Ici)', fmt(result.exactCountBy.initialCurrent, 2), result.countBy.initialCurrent],
                ['Final current (N·Iaf >= Icf)', fmt(result.exactCountBy.finalCurrent, 2), result.countBy.finalCurrent],
              ]}
            />
            <Text style={{ ...pdf.small, marginTop: 6, marginBottom: 2 }}>Current demand and distribution</Text>
            <PdfTable
              columns={[
                { label: 'Zone', width: 26 },
                { label: 'fc i/m/f', width: 20, align: 'right' },
                { label: 'Ici A', width: 12, align: 'right' },
                { label: 'Icm A', width: 12, align: 'right' },
                { label: 'Icf A', width: 12, align: 'right' },
                { label: 'Anodes', width: 18, align: 'right' },
              ]}
              rows={[
                ...result.surfaces.map((s, i) => [
                  s.name,
                  `${fmt(s.breakdown.initial, 3)}/${fmt(s.breakdown.mean, 3)}/${fmt(s.breakdown.final, 3)}`,
                  fmtSig(s.initialA),
                  fmtSig(s.meanA),
                  fmtSig(s.finalA),
                  result.distribution.surfaces[i]?.count ?? '–',
                ]),
                ['Total', '', fmtSig(result.current.initialA), fmtSig(result.current.meanA), fmtSig(result.current.finalA), result.distribution.distributedCount],
              ]}
              bold={[result.surfaces.length]}
            />
            <Text style={{ ...pdf.small, marginTop: 6, marginBottom: 2 }}>Anode</Text>
            <PdfTable
              columns={[{ label: 'Quantity', width: 55 }, { label: 'Value', width: 45, align: 'right' }]}
              rows={[
                ['Required net mass M', `${fmt(result.requiredNetMassKg, 1)} kg`],
                ['Driving voltage Ec - Ea', `${fmt(result.drivingVoltageV, 3)} V`],
                ['Resistance, initial / end of life', `${fmtSig(result.perAnode.initialResistanceOhm, 4)} / ${fmtSig(result.perAnode.finalResistanceOhm, 4)} Ω`],
                ['Output, initial / end of life', `${fmtSig(result.perAnode.initialOutputA)} / ${fmtSig(result.perAnode.finalOutputA)} A${result.perAnode.ratedOutputUsed ? ' (data sheet)' : ''}`],
                ['Installed net / gross mass', `${fmt(result.installedNetMassKg, 1)} / ${result.installedGrossMassKg !== null ? fmt(result.installedGrossMassKg, 1) : '–'} kg`],
                ['Achieved life', `${fmt(result.achievedLifeYears, 2)} years`],
              ]}
            />
          </View>
        ) : (
          <Text style={pdf.warning}>No valid results: {data.resultError ?? 'the inputs cannot be sized.'}</Text>
        )}

        <Text style={pdf.h2}>5. Warnings</Text>
        {[...(result?.warnings ?? []), ...data.notices].length ? (
          [...(result?.warnings ?? []), ...data.notices].map((w, i) => (
            <Text key={i} style={pdf.warning}>
              Warning: {w.message}
            </Text>
          ))
        ) : (
          <Text>None raised by the checks.</Text>
        )}

        <Text style={pdf.h2}>6. Sources</Text>
        {(result?.basis ?? []).map((b, i) => (
          <Text key={i} style={pdf.small}>
            {b.topic}: {b.source} ({b.flag === 'memory' ? 'value to be confirmed against the licensed edition' : b.flag})
          </Text>
        ))}

        <Text style={pdf.h2}>7. Revision block</Text>
        <PdfTable
          columns={[{ label: '', width: 20 }, { label: 'Name', width: 45 }, { label: 'Date', width: 35 }]}
          rows={data.signatures.map((s) => [s.role, s.name ?? '', s.at ? format(s.at, 'd MMM yyyy HH:mm') : ''])}
        />
        <Text style={pdf.caution}>{CAUTION_TEXT}</Text>
        {/* A static footer: react-pdf 4.9 drops a fixed footer that uses render() on pages it splits itself. */}
        <View style={pdf.footer} fixed>
          <Text>{footer}</Text>
          <Text>{`Printed ${format(data.printedAt, 'd MMM yyyy HH:mm')} by ${data.printedBy}`}</Text>
        </View>
      </Page>
    </Document>
  );
}
