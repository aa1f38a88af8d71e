import { lazy, Suspense, useEffect, useRef, useState, type ReactElement } from 'react';
import { addedPartToHref } from '../../lib/register/parts-href';
import { fetchTeamSettings, type TeamSettingsAnswer } from './team-settings-query';

// The form — react-hook-form, zod, the shared schema and TanStack Query — loads only when opened.
const loadAddPart = () => import('./AddPartPanel');
const AddPartPanel = lazy(loadAddPart);

interface Props {
  /** Where to go once a part is added; the page then names it. Tests pass their own. */
  onAdded?: (href: string) => void;
}

const goTo = (href: string) => window.location.assign(href);

/** The parts page's one island, for roles that may add parts: "Add a part" and, once opened, the form. */
export default function PartActions({ onAdded = goTo }: Props): ReactElement {
  // The team's defaults are asked for when the form is opened, while its code is still on the way.
  const [settings, setSettings] = useState<Promise<TeamSettingsAnswer> | null>(null);

  const button = useRef<HTMLButtonElement>(null);

  const open = () => {
    const answer = fetchTeamSettings();
    // The form reports a failure itself; this keeps it from also being an unhandled rejection.
    answer.catch(() => undefined);
    setSettings(answer);
  };

  // A press made before this island hydrated was noted on the button by the page's script: honour it now.
  useEffect(() => {
    const element = button.current;
    if (!element) return;
    element.dataset.ready = 'true';
    if (element.dataset.pressed) {
      delete element.dataset.pressed;
      open();
    }
  }, []);

  if (!settings) {
    return (
      <div className="mb-4">
        <button
          ref={button}
          type="button"
          className="btn"
          data-add-part
          onClick={open}
          onPointerEnter={() => void loadAddPart()}
          onFocus={() => void loadAddPart()}
        >
          Add a part
        </button>
      </div>
    );
  }
  return (
    <section aria-labelledby="add-part-heading" className="card mb-6">
      <h2 id="add-part-heading" className="mb-3">
        Add a part
      </h2>
      <Suspense fallback={<p role="status">Loading the form…</p>}>
        <AddPartPanel
          settings={settings}
          onCancel={() => setSettings(null)}
          onCreated={(part) => onAdded(addedPartToHref(part.id))}
        />
      </Suspense>
    </section>
  );
}
