import { useEffect, useRef, useState, type RefObject } from 'react';
import { useWatch, type UseFormReturn } from 'react-hook-form';
import type { InspectionDraft } from '../../lib/inspections/schemas';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import type { DraftSync } from './draft-sync';
import { inspectionApi } from './inspection-api';
import type { SheetContext } from './sheet-context';

const NONE: SheetContext = { gearSet: null, profile: null };

/**
 * The gear set and its tolerance profile for the sheet, and the runs Lashline counts for the set at
 * the inspection time. Fetched when there is a connection, kept with the browser copy for when
 * there is not. A fresh sheet is prefilled (assembly, runs) unless the technician already chose.
 */
export function useSheetContext(o: {
  form: UseFormReturn<SheetValues, unknown, InspectionDraft>;
  sync: DraftSync;
  initial: SheetContext | null;
  countedRef: RefObject<number | null>;
  online: boolean;
  fresh: boolean;
  countRuns: boolean;
}) {
  const { form, sync, online } = o;
  const [context, setContext] = useState<SheetContext>(o.initial ?? NONE);
  const countedRef = o.countedRef;
  const [countedRuns, setCountedRuns] = useState<number | null>(countedRef.current);
  const contextRef = useRef(context);
  const [gearSetId, inspectedAt] = useWatch({ control: form.control, name: ['gearSetId', 'inspectedAt'] });

  useEffect(() => {
    if (!gearSetId || !online) return;
    let live = true;
    void Promise.all([inspectionApi.gearSet(gearSetId), inspectionApi.profile(gearSetId)]).then(([set, profile]) => {
      if (!live) return;
      const prev = contextRef.current.gearSet?.id === gearSetId ? contextRef.current : NONE;
      const next: SheetContext = {
        gearSet: set.ok ? set.data : prev.gearSet,
        profile: profile.ok ? profile.data : prev.profile,
      };
      contextRef.current = next;
      setContext(next);
      sync.change({ context: next }, false);
      const place = set.ok ? set.data.location : null;
      if (
        o.fresh &&
        place?.targetType === 'assembly' &&
        !form.getValues('assemblyId') &&
        !form.getFieldState('assemblyId').isDirty
      ) {
        form.setValue('assemblyId', place.targetId);
      }
    });
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- refetch for a new set or a new connection
  }, [gearSetId, online]);

  useEffect(() => {
    if (!o.countRuns || !gearSetId || !inspectedAt || !online) return;
    let live = true;
    const timer = setTimeout(() => {
      void inspectionApi.runCount(gearSetId, inspectedAt).then((answer) => {
        if (!live || !answer.ok) return;
        const counted = answer.data.totalRuns;
        const previous = countedRef.current;
        const current = form.getValues('runsAtInspection');
        countedRef.current = counted;
        setCountedRuns(counted);
        sync.change({ countedRuns: counted }, false);
        // Follow the count until the technician types their own figure.
        if (current === null || current === undefined || current === previous)
          form.setValue('runsAtInspection', counted);
      });
    }, 250);
    return () => {
      live = false;
      clearTimeout(timer);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- recount for a new set, time or connection
  }, [gearSetId, inspectedAt, online]);

  const shown = context.gearSet && context.gearSet.id !== gearSetId ? NONE : context;
  return { context: shown, countedRuns };
}
