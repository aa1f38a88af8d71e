import type { AssemblyView, PartView } from '../../lib/register/views';
import { PART_KIND_LABELS } from '../../lib/register/kinds';
import { AssemblyParts } from './AssemblyParts';
import { FitPicker } from './FitPicker';

export type Move = { action: 'install' | 'remove'; partId?: string; assemblyId?: string; carId?: string };

interface Props {
  assembly: AssemblyView;
  inside: PartView[];
  /** Parts installed nowhere and still usable. */
  loose: PartView[];
  dueWithin: number;
  canInstall: boolean;
  busy: boolean;
  onMove: (move: Move, placeId: string, done: string) => Promise<void>;
}

/** One assembly's parts, a take-out for each, and the picker that fits another. */
export function AssemblyContents({ assembly, inside, loose, dueWithin, canInstall, busy, onMove }: Props) {
  // One gear set per assembly: while it holds one, the picker offers no other.
  const holdsGearSet = inside.find((p) => p.kind === 'gear-set');
  const options = loose
    .filter((p) => !(holdsGearSet && p.kind === 'gear-set'))
    .map((p) => ({
      value: p.id,
      label: `${p.serial} — ${PART_KIND_LABELS[p.kind]}${p.ratioLabel ? ` ${p.ratioLabel}` : ''}, ${p.totalRuns} runs`,
    }));
  return (
    <div className="flex flex-col gap-3">
      <AssemblyParts
        placeName={assembly.serial}
        parts={inside}
        dueWithin={dueWithin}
        canInstall={canInstall}
        busy={busy}
        onRemove={(part) =>
          onMove({ action: 'remove', partId: part.id }, assembly.id, `${part.serial} is out of ${assembly.serial}.`)
        }
      />
      {canInstall && (
        <FitPicker
          label={`Fit a part into ${assembly.serial}`}
          options={options}
          buttonLabel="Fit part"
          emptyText="No spare parts to fit: every part is installed, retired or scrapped."
          busy={busy}
          onFit={(partId) => {
            const part = loose.find((p) => p.id === partId);
            void onMove(
              { action: 'install', partId, assemblyId: assembly.id },
              assembly.id,
              `${part?.serial ?? 'The part'} is in ${assembly.serial}.`,
            );
          }}
        />
      )}
      {canInstall && holdsGearSet && (
        <p className="text-sm text-ink-soft">
          {assembly.serial} holds gear set {holdsGearSet.serial}; take it out to fit another.
        </p>
      )}
    </div>
  );
}
