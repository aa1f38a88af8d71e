import { toCsv } from './csv';
import { findResolution } from '../units';
import type { InspectionData } from '../inspections/record';

/**
 * An inspection as CSV, one row per backlash reading: the value as typed with its unit, the same in
 * mm, the position's angle from the marked tooth, and the indicator resolution.
 */
export function inspectionToCsv(inspection: {
  id: string;
  gearSetSerial: string;
  inspectedAt: string;
  runsAtInspection: number;
  status: string;
  data: InspectionData;
}): string {
  const { data } = inspection;
  const resolution = findResolution(data.entry.resolution);
  const n = data.backlashMm.length;
  const rows = data.backlashMm.map((mm, index) => ({
    inspection_id: inspection.id,
    gear_set: inspection.gearSetSerial,
    inspected_at: inspection.inspectedAt,
    runs_at_inspection: inspection.runsAtInspection,
    status: inspection.status,
    position: index + 1,
    angle_deg: (360 * index) / n,
    backlash: mm === null ? '' : Number((data.entry.unit === 'in' ? mm / 25.4 : mm).toFixed(9)),
    unit: data.entry.unit,
    backlash_mm: mm === null ? '' : Number(mm.toFixed(9)),
    resolution: resolution?.label ?? data.entry.resolution,
  }));
  return toCsv(rows);
}
