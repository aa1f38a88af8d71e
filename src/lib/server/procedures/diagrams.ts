import { drawTighteningDiagram } from '../../procedures/diagram';
import { EXAMPLE_FIGURE_NOTICE } from '../../procedures/cautions';
import { formatTorque, groupToPassTorques } from '../../procedures/fasteners';
import { findStep, type ProcedureStep } from '../../procedures/model';
import type { TorqueUnit } from '../../units';
import { HttpError } from '../http';
import { getProcedure } from './procedures';

/** The step of the team's procedure (any version); 404 when the procedure or the step is not there. */
export async function requireProcedureStep(
  teamId: string,
  procedureId: string,
  stepId: string,
  version?: number,
): Promise<ProcedureStep> {
  const procedure = await getProcedure(teamId, procedureId, version);
  const step = findStep(procedure.sections, stepId);
  if (!step) throw new HttpError(404, 'No such step in this procedure.');
  return step;
}

/** The tightening diagram of a step, with its passes in `unit`; 404 when the step has no tightening order. */
export async function drawStepDiagram(
  teamId: string,
  procedureId: string,
  stepId: string,
  options: { version?: number | undefined; unit: TorqueUnit },
): Promise<string> {
  const procedure = await getProcedure(teamId, procedureId, options.version);
  const step = findStep(procedure.sections, stepId);
  if (!step) throw new HttpError(404, 'No such step in this procedure.');
  const group = step.fasteners;
  if (!group?.sequence) throw new HttpError(404, 'This step has no tightening order, so no diagram.');
  const figure = group.torque
    ? `Team figure: ${formatTorque(group.torque.value, group.torque.unit)}, from ${group.torqueSource ?? 'a source not given'}`
    : undefined;
  return drawTighteningDiagram({
    count: group.count,
    passes: groupToPassTorques(group, options.unit),
    title: [step.title, figure].filter(Boolean).join('. '),
    ...(procedure.example ? { exampleNotice: `Torque figures here are an ${EXAMPLE_FIGURE_NOTICE}.` } : {}),
  });
}
