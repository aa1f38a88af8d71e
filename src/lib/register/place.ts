/**
 * Where a part is, in words that name the car as well as the assembly, from lookups the page
 * already holds (the part's own label names only the assembly).
 */
export interface PlaceLookup {
  assemblies: Record<string, { serial: string; name: string; carId: string | null }>;
  cars: Record<string, string>;
}

export interface PartLocation {
  targetType: 'assembly' | 'car';
  targetId: string;
  label: string;
}

/**
 * @example locationToText({ targetType: 'assembly', targetId: 'a1', label: '…' }, lookup) // 'RE-01 Ember rear end · in 714 Ember'
 */
export function locationToText(location: PartLocation | null, lookup: PlaceLookup): string {
  if (!location) return 'Not installed';
  if (location.targetType === 'car') {
    const car = lookup.cars[location.targetId];
    return car ? `In ${car} (no assembly)` : location.label;
  }
  const assembly = lookup.assemblies[location.targetId];
  if (!assembly) return location.label;
  const car = assembly.carId ? lookup.cars[assembly.carId] : undefined;
  return `${assembly.serial} ${assembly.name} · ${car ? `in ${car}` : 'on the shelf'}`;
}

/** The lookups from the lists the register endpoints answer with. */
export function listsToPlaceLookup(
  assemblies: readonly { id: string; serial: string; name: string; carId: string | null }[],
  cars: readonly { id: string; name: string }[],
): PlaceLookup {
  return {
    assemblies: Object.fromEntries(assemblies.map((a) => [a.id, { serial: a.serial, name: a.name, carId: a.carId }])),
    cars: Object.fromEntries(cars.map((c) => [c.id, c.name])),
  };
}
