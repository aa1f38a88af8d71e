import type { ReactNode } from 'react';
import type { AssemblyView, CarView } from '../../lib/register/views';
import { RecordForm } from '../shared/RecordForm';

interface Props {
  /** The message slot of a place on the cars screen. */
  say: (placeId: string) => ReactNode;
  onSaved: (placeId: string, text: string) => Promise<void>;
}

/** Add a car and add an assembly, for the roles that edit the register. */
export function AddRecords({ say, onSaved }: Props) {
  return (
    <div className="grid gap-6 md:grid-cols-2">
      <section aria-labelledby="add-car-heading" className="card">
        <h2 id="add-car-heading" className="mb-3">
          Add a car
        </h2>
        {say('new-car')}
        <RecordForm<CarView>
          endpoint="/api/cars"
          submitLabel="Add the car"
          fields={[
            {
              name: 'name',
              label: 'Number or name',
              hint: 'As the crew says it, e.g. 714 Ember. CSV imports match it exactly.',
            },
            { name: 'carClass', label: 'Class', optional: true },
            { name: 'notes', label: 'Notes', optional: true, multiline: true },
          ]}
          onSaved={(car) => onSaved('new-car', `Added ${car.name}.`)}
        />
      </section>
      <section aria-labelledby="add-assembly-heading" className="card">
        <h2 id="add-assembly-heading" className="mb-3">
          Add a rear-end assembly
        </h2>
        {say('new-assembly')}
        <RecordForm<AssemblyView>
          endpoint="/api/assemblies"
          submitLabel="Add the assembly"
          fields={[
            { name: 'serial', label: 'Serial', hint: 'e.g. RE-04' },
            { name: 'name', label: 'Name', hint: 'e.g. Spare rear end' },
            { name: 'housing', label: 'Housing', optional: true },
            { name: 'notes', label: 'Notes', optional: true, multiline: true },
          ]}
          onSaved={(assembly) => onSaved('new-assembly', `Added ${assembly.serial}; it is on the shelf.`)}
        />
      </section>
    </div>
  );
}
