/** The kinds of serial-numbered part the register keeps, and the states a part can be in. */
export const PART_KINDS = ['gear-set', 'spindle', 'axle', 'drive-hub', 'hub', 'bearing', 'other'] as const;
export type PartKind = (typeof PART_KINDS)[number];

export const PART_STATUSES = ['spare', 'in-service', 'under-review', 'retired', 'scrapped'] as const;
export type PartStatus = (typeof PART_STATUSES)[number];

export const PART_KIND_LABELS: Record<PartKind, string> = {
  'gear-set': 'Gear set',
  spindle: 'Spindle',
  axle: 'Axle',
  'drive-hub': 'Drive hub',
  hub: 'Hub',
  bearing: 'Bearing',
  other: 'Other',
};

export const PART_STATUS_LABELS: Record<PartStatus, string> = {
  spare: 'Spare',
  'in-service': 'In service',
  'under-review': 'Under review',
  retired: 'Retired',
  scrapped: 'Scrapped',
};

/** Statuses a part cannot be installed from. */
export const OUT_OF_USE: readonly PartStatus[] = ['retired', 'scrapped'];
