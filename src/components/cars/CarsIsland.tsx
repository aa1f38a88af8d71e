import { useState } from 'react';
import type { AssemblyView, CarView, PartView } from '../../lib/register/views';
import { OUT_OF_USE, PART_KIND_LABELS } from '../../lib/register/kinds';
import { callApi, messageWithoutField, type Page } from '../shared/api';
import { ConfirmAction } from '../shared/ConfirmAction';
import { StatusMark } from '../shared/StatusMark';
import { isoToText } from '../shared/when';
import { useHydrated } from '../shared/use-hydrated';
import { AddRecords } from './AddRecords';
import { AssemblyContents, type Move } from './AssemblyContents';
import { AssemblyParts } from './AssemblyParts';
import { FitPicker } from './FitPicker';

export interface CarsIslandProps {
  cars: CarView[];
  assemblies: AssemblyView[];
  parts: PartView[];
  canInstall: boolean;
  canEdit: boolean;
  dueWithin: number;
}

interface Register {
  cars: CarView[];
  assemblies: AssemblyView[];
  parts: PartView[];
}

interface Message {
  placeId: string;
  tone: 'ok' | 'error';
  text: string;
}

const assemblyName = (a: AssemblyView) => `${a.serial} ${a.name}`;

/** Cars, the rear end in each, and every assembly's parts, with install and take-out actions. */
export default function CarsIsland({ canInstall, canEdit, dueWithin, ...initial }: CarsIslandProps) {
  const hydrated = useHydrated();
  const [data, setData] = useState<Register>(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<Message | null>(null);

  const refresh = async (): Promise<boolean> => {
    const [cars, assemblies, parts] = await Promise.all([
      callApi<Page<CarView>>('/api/cars?limit=500'),
      callApi<Page<AssemblyView>>('/api/assemblies?limit=500'),
      callApi<Page<PartView>>('/api/parts?limit=500'),
    ]);
    if (!cars.ok || !assemblies.ok || !parts.ok) return false;
    setData({ cars: cars.data.items, assemblies: assemblies.data.items, parts: parts.data.items });
    return true;
  };

  const move = async (body: Move, placeId: string, done: string) => {
    setBusy(true);
    setMessage(null);
    const answer = await callApi('/api/installations', { method: 'POST', body });
    // Refresh either way: a 409 usually means someone else moved it first.
    const fresh = await refresh();
    setBusy(false);
    if (answer.ok)
      setMessage({
        placeId,
        tone: 'ok',
        text: fresh ? done : `${done} The lists could not be refreshed; reload the page.`,
      });
    else setMessage({ placeId, tone: 'error', text: messageWithoutField(answer.problem) });
  };

  const partsIn = (type: 'assembly' | 'car', id: string) =>
    data.parts.filter((p) => p.location?.targetType === type && p.location.targetId === id);
  const loose = data.parts.filter((p) => !p.location && !OUT_OF_USE.includes(p.status));
  const shelf = data.assemblies.filter((a) => !a.carId);
  const freeCars = data.cars.filter((c) => !data.assemblies.some((a) => a.carId === c.id));

  const say = (placeId: string) =>
    message?.placeId === placeId ? (
      <p
        className={`notice mb-3 ${message.tone === 'error' ? 'notice-error' : ''}`}
        role={message.tone === 'error' ? 'alert' : 'status'}
      >
        {message.text}
      </p>
    ) : null;

  const assemblyBlock = (assembly: AssemblyView) => (
    <AssemblyContents
      assembly={assembly}
      inside={partsIn('assembly', assembly.id)}
      loose={loose}
      dueWithin={dueWithin}
      canInstall={canInstall}
      busy={busy}
      onMove={move}
    />
  );

  return (
    <div className="flex flex-col gap-6">
      {data.cars.length === 0 && <p className="card">No cars yet.{canEdit ? ' Add one below.' : ''}</p>}
      {data.cars.map((car) => {
        const assembly = data.assemblies.find((a) => a.carId === car.id);
        const direct = partsIn('car', car.id);
        return (
          <section key={car.id} aria-labelledby={`car-${car.id}`} className="card" data-testid="car-card">
            <h2 id={`car-${car.id}`} className="text-2xl">
              {car.name}
            </h2>
            <p className="mb-3 text-ink-soft">
              {[
                car.carClass,
                `${car.totalRuns} runs logged`,
                car.lastRunAt ? `last ${isoToText(car.lastRunAt, hydrated)}` : null,
              ]
                .filter(Boolean)
                .join(' · ')}
            </p>
            {say(car.id)}
            {assembly ? (
              <div className="rounded-md border-2 border-rule p-3">
                <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
                  <div>
                    <h3 className="text-lg font-bold">
                      Rear end: {assembly.serial} · {assembly.name}
                    </h3>
                    {assembly.housing && <p className="text-sm text-ink-soft">{assembly.housing}</p>}
                  </div>
                  {canInstall && (
                    <ConfirmAction
                      label="Take rear end out"
                      question={`Take ${assembly.serial} out of ${car.name}? Its parts stay in it, and stop counting this car’s runs.`}
                      confirmLabel="Yes, take it out"
                      busy={busy}
                      onConfirm={() =>
                        move(
                          { action: 'remove', assemblyId: assembly.id },
                          car.id,
                          `${assembly.serial} is out of ${car.name} and on the shelf.`,
                        )
                      }
                    />
                  )}
                </div>
                {say(assembly.id)}
                {assemblyBlock(assembly)}
              </div>
            ) : (
              <div className="flex flex-col gap-2">
                <p>No rear end fitted.</p>
                {canInstall && (
                  <FitPicker
                    label={`Fit a rear end into ${car.name}`}
                    options={shelf.map((a) => ({ value: a.id, label: assemblyName(a) }))}
                    buttonLabel="Fit rear end"
                    emptyText="No rear end on the shelf."
                    busy={busy}
                    onFit={(assemblyId) => {
                      const a = data.assemblies.find((x) => x.id === assemblyId);
                      void move(
                        { action: 'install', assemblyId, carId: car.id },
                        car.id,
                        `${a?.serial ?? 'The rear end'} is in ${car.name}.`,
                      );
                    }}
                  />
                )}
              </div>
            )}
            {direct.length > 0 && (
              <div className="mt-3">
                <h3 className="mb-1 font-bold">Fitted straight to the car</h3>
                <AssemblyParts
                  placeName={car.name}
                  parts={direct}
                  dueWithin={dueWithin}
                  canInstall={canInstall}
                  busy={busy}
                  onRemove={(part) =>
                    move({ action: 'remove', partId: part.id }, car.id, `${part.serial} is out of ${car.name}.`)
                  }
                />
              </div>
            )}
          </section>
        );
      })}

      <section aria-labelledby="shelf-heading" className="flex flex-col gap-4">
        <h2 id="shelf-heading">Rear ends on the shelf</h2>
        {shelf.length === 0 && <p className="text-ink-soft">Every assembly is in a car.</p>}
        {shelf.map((assembly) => (
          <section key={assembly.id} aria-labelledby={`assembly-${assembly.id}`} className="card">
            <div className="mb-2 flex flex-wrap items-end justify-between gap-2">
              <div>
                <h3 id={`assembly-${assembly.id}`} className="text-lg font-bold">
                  {assemblyName(assembly)}
                </h3>
                {assembly.housing && <p className="text-sm text-ink-soft">{assembly.housing}</p>}
              </div>
              {canInstall && (
                <FitPicker
                  label={`Put ${assembly.serial} in a car`}
                  options={freeCars.map((c) => ({ value: c.id, label: c.name }))}
                  buttonLabel="Fit in car"
                  emptyText="Every car has a rear end; take one out first."
                  busy={busy}
                  onFit={(carId) => {
                    const car = data.cars.find((c) => c.id === carId);
                    void move(
                      { action: 'install', assemblyId: assembly.id, carId },
                      assembly.id,
                      `${assembly.serial} is in ${car?.name ?? 'the car'}.`,
                    );
                  }}
                />
              )}
            </div>
            {say(assembly.id)}
            {assemblyBlock(assembly)}
          </section>
        ))}
      </section>

      <section aria-labelledby="loose-heading" className="card">
        <h2 id="loose-heading" className="mb-2">
          Parts not installed
        </h2>
        {loose.length === 0 ? (
          <p className="text-ink-soft">None: every usable part is in an assembly or a car.</p>
        ) : (
          <ul className="grid gap-2 sm:grid-cols-2">
            {loose.map((part) => (
              <li key={part.id} className="flex flex-wrap items-center gap-2">
                <a href={`/parts/${encodeURIComponent(part.id)}`} className="tap-link font-bold">
                  {part.serial}
                </a>
                <span className="text-ink-soft">
                  {PART_KIND_LABELS[part.kind]}
                  {part.ratioLabel ? ` ${part.ratioLabel}` : ''}
                </span>
                <StatusMark status={part.status} />
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-sm text-ink-soft">
          Retired and scrapped parts are listed on the <a href="/parts">parts page</a>.
        </p>
      </section>

      {canEdit && (
        <AddRecords
          say={say}
          onSaved={async (placeId, text) => {
            await refresh();
            setMessage({ placeId, tone: 'ok', text });
          }}
        />
      )}
    </div>
  );
}
