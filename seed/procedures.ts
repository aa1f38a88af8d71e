import type { TeamAccess } from '../src/lib/server/guard';
import { DEMO_ACCOUNTS } from '../src/lib/server/demo';
import { stepChangeSchema, type StepChangeInput } from '../src/lib/procedures/schemas';
import { changeChecklistStep, completeChecklist, signOffChecklist } from '../src/lib/server/procedures/checklist-steps';
import { startChecklist } from '../src/lib/server/procedures/checklists';
import { createProcedure, type ProcedureContent } from '../src/lib/server/procedures/procedures';
import { DEMO_TEAM_NAME, type SeededPeople } from './people';
import type { SeededRegister } from './register';

/**
 * Demo procedures: a teardown and inspection and a ring-and-pinion set-up. Every torque figure here
 * is invented for the demo, never taken from a real sheet; the procedures are marked as examples, so
 * every figure shows "example figure — use the part maker's". RE-01's set-up with GS-4101 in May is
 * completed and signed off; RE-02's teardown for GS-4102's review is in progress.
 */
const SOURCE = 'the demo’s invented example (use the part maker’s sheet)';

const TEARDOWN: ProcedureContent = {
  name: 'Rear-end teardown and inspection',
  purpose: 'Teardown and inspection between rounds',
  appliesTo: 'The team’s 9-inch style rear ends (RE-01, RE-02, RE-03)',
  notes: 'Photograph the contact pattern before cleaning anything off the teeth.',
  sections: [
    {
      title: 'Open up',
      steps: [
        {
          title: 'Let it cool, then drain the oil',
          instructions:
            'Wait until the housing is **cool to the touch**.\n\n- Catch the oil in a clean pan\n- Look for metal on the drain plug magnet',
          caution: 'Hot oil and housing right after a run.',
          records: 'note',
        },
        {
          title: 'Turning torque before removal',
          instructions: 'Turn the pinion by the nut with a dial torque wrench and read the steady value.',
          records: 'turning-torque',
        },
        { title: 'Measure backlash', instructions: 'Four positions, 90° apart.', records: 'backlash' },
        {
          title: 'Remove the third member',
          instructions: 'Take the nuts off in a cross pattern; support the centre section as it comes free.',
          fasteners: { count: 10, description: '3/8-24 nuts', passesPercent: [100], sequence: false },
        },
      ],
    },
    {
      title: 'Close up',
      steps: [
        {
          title: 'Third member nuts',
          instructions: 'Clean threads, fresh gasket.',
          fasteners: {
            count: 10,
            description: '3/8-24 nuts',
            torque: { value: 30, unit: 'lbf-ft' },
            torqueSource: SOURCE,
            passesPercent: [50, 100],
            sequence: true,
            compound: { kind: 'sealant', note: 'thin bead on the gasket' },
          },
        },
        { title: 'Fill and check for leaks', records: 'note' },
      ],
    },
  ],
};

const SET_UP: ProcedureContent = {
  name: 'Ring-and-pinion set-up',
  purpose: 'Set-up of a new or re-shimmed gear set',
  appliesTo: 'Gear sets in the team’s 9-inch style third members',
  sections: [
    {
      title: 'Ring gear',
      steps: [
        {
          title: 'Ring gear bolts',
          instructions: 'Clean the bolts and the carrier threads. Bolts go in dry apart from the compound.',
          fasteners: {
            count: 10,
            description: '7/16-20 bolts, grade 8',
            torque: { value: 55, unit: 'lbf-ft' },
            torqueSource: SOURCE,
            passesPercent: [30, 70, 100],
            sequence: true,
            compound: { kind: 'thread-locker', note: 'medium strength' },
          },
        },
      ],
    },
    {
      title: 'Pinion and carrier',
      steps: [
        {
          title: 'Pinion nut',
          instructions: 'Tighten in small steps, checking the turning torque between them.',
          fasteners: {
            count: 1,
            description: 'pinion nut',
            torque: { value: 150, unit: 'lbf-ft' },
            torqueSource: SOURCE,
            passesPercent: [100],
            sequence: false,
          },
        },
        { title: 'Pinion turning torque', records: 'turning-torque' },
        {
          title: 'Carrier bearing caps',
          fasteners: {
            count: 4,
            description: '1/2-13 cap bolts',
            torque: { value: 65, unit: 'lbf-ft' },
            torqueSource: SOURCE,
            passesPercent: [50, 100],
            sequence: true,
          },
        },
        { title: 'Backlash', records: 'backlash' },
        { title: 'Runout of the ring gear', records: 'runout' },
        { title: 'Contact pattern check', instructions: 'Marking compound on both sides; photograph each.' },
      ],
    },
  ],
};

const at = (iso: string) => new Date(iso);

export async function seedProcedures(people: SeededPeople, register: SeededRegister): Promise<void> {
  const accessOf = (role: 'crew-chief' | 'technician'): TeamAccess => {
    const account = DEMO_ACCOUNTS.find((a) => a.role === role)!;
    return {
      user: {
        id: people.userIds[role],
        email: account.email,
        name: account.name,
        lengthUnit: 'in',
        torqueUnit: 'lbf-in',
        currentTeamId: people.teamId,
        secondFactor: false,
      },
      team: { id: people.teamId, name: DEMO_TEAM_NAME, role },
    };
  };
  const chief = accessOf('crew-chief');
  const tech = accessOf('technician');
  const teardown = await createProcedure(chief, TEARDOWN, { example: true });
  const setUp = await createProcedure(chief, SET_UP, { example: true });
  const ids = (sections: { steps: { id: string }[] }[]) => sections.flatMap((s) => s.steps.map((step) => step.id));

  // May: GS-4101 set up in RE-01, every step recorded, completed and signed off.
  const done = await startChecklist(
    tech,
    { procedureId: setUp.id, assemblyId: register.assemblyIds.re01, gearSetId: register.gearSetIds['GS-4101']! },
    at('2026-05-12T08:30:00Z'),
  );
  const [ring, pinion, turning, caps, backlash, runout, pattern] = ids(setUp.sections) as [string, ...string[]];
  // Through the endpoint's schema, so the demo holds only what the API would accept.
  const recordOn = (checklistId: string, stepId: string, change: StepChangeInput, when: string) =>
    changeChecklistStep(tech, checklistId, stepId, stepChangeSchema.parse({ ...change, at: when }), null, at(when));
  const record = (stepId: string, change: StepChangeInput, when: string) => recordOn(done.id, stepId, change, when);
  await record(
    ring,
    {
      status: 'done',
      torqueApplied: [
        { pass: 1, value: 16.5, unit: 'lbf-ft' },
        { pass: 2, value: 38.5, unit: 'lbf-ft' },
        { pass: 3, value: 55, unit: 'lbf-ft' },
      ],
      boltsInOrder: [1, 6, 3, 8, 5, 10, 2, 7, 4, 9],
    },
    '2026-05-12T09:00:00Z',
  );
  await record(
    pinion!,
    { status: 'done', torqueApplied: [{ pass: 1, value: 150, unit: 'lbf-ft' }] },
    '2026-05-12T09:20:00Z',
  );
  await record(turning!, { status: 'done', value: 14, valueUnit: 'lbf-in' }, '2026-05-12T09:25:00Z');
  await record(
    caps!,
    { status: 'done', boltsInOrder: [1, 3, 2, 4], note: 'Second pass done twice: the first cap bolt crept.' },
    '2026-05-12T09:40:00Z',
  );
  await record(backlash!, { status: 'done', value: 0.009, valueUnit: 'in' }, '2026-05-12T09:50:00Z');
  await record(runout!, { status: 'done', value: 0.001, valueUnit: 'in' }, '2026-05-12T09:55:00Z');
  await record(pattern!, { status: 'done', note: 'Pattern centred on both sides.' }, '2026-05-12T10:10:00Z');
  await completeChecklist(tech, done.id, at('2026-05-12T10:15:00Z'));
  await signOffChecklist(chief, done.id, 'Checked the pattern photos; good to go.', at('2026-05-12T11:00:00Z'));

  // July: RE-02 comes apart for GS-4102's review; the first two steps are done.
  const running = await startChecklist(
    tech,
    { procedureId: teardown.id, assemblyId: register.assemblyIds.re02, gearSetId: register.gearSetIds['GS-4102']! },
    at('2026-07-14T08:00:00Z'),
  );
  const [drain, turningBefore] = ids(teardown.sections);
  await recordOn(running.id, drain!, { status: 'done', note: 'Fine glitter on the magnet.' }, '2026-07-14T08:40:00Z');
  await recordOn(
    running.id,
    turningBefore!,
    { status: 'done', value: 11, valueUnit: 'lbf-in' },
    '2026-07-14T08:50:00Z',
  );
}
