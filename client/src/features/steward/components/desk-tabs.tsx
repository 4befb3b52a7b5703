import { useRef, type KeyboardEvent, type ReactNode } from 'react';
import { cx } from '../../../components/ui/cx';

export interface DeskTab<Id extends string> {
  id: Id;
  label: string;
  /** e.g. how many are waiting; read out with the label */
  count?: number;
}

/**
 * Tabs in the WAI-ARIA pattern: one tab stop, arrows (and Home/End) move between tabs and
 * select them. On a phone they are a grid of tiles, so every one stays in sight.
 */
export function DeskTabs<Id extends string>({ tabs, current, onSelect, label, children }: { tabs: DeskTab<Id>[]; current: Id; onSelect: (id: Id) => void; label: string; children: ReactNode }) {
  const refs = useRef(new Map<Id, HTMLButtonElement>());
  const move = (event: KeyboardEvent, index: number) => {
    const next =
      event.key === 'ArrowRight' ? (index + 1) % tabs.length
      : event.key === 'ArrowLeft' ? (index - 1 + tabs.length) % tabs.length
      : event.key === 'Home' ? 0
      : event.key === 'End' ? tabs.length - 1
      : null;
    if (next === null) return;
    event.preventDefault();
    onSelect(tabs[next].id);
    refs.current.get(tabs[next].id)?.focus();
  };

  return (
    <div>
      <div role="tablist" aria-label={label} className="grid grid-cols-2 gap-2 sm:flex sm:flex-wrap sm:gap-1 sm:border-b-2 sm:border-line">
        {tabs.map((tab, index) => {
          const selected = tab.id === current;
          return (
            <button
              key={tab.id}
              ref={(el) => {
                if (el) refs.current.set(tab.id, el);
                else refs.current.delete(tab.id);
              }}
              type="button"
              role="tab"
              id={`desk-tab-${tab.id}`}
              aria-selected={selected}
              aria-controls={`desk-panel-${tab.id}`}
              tabIndex={selected ? 0 : -1}
              onClick={() => onSelect(tab.id)}
              onKeyDown={(e) => move(e, index)}
              className={cx(
                // Phone: a grid of tiles; wider: a row of tabs on a rule.
                'flex min-h-12 items-center justify-between gap-2 rounded-soft border-2 px-3 text-left font-bold',
                'sm:-mb-0.5 sm:shrink-0 sm:justify-start sm:whitespace-nowrap sm:rounded-b-none sm:border-0 sm:border-b-4',
                selected ? 'border-moss bg-moss-mist text-moss-deep' : 'border-line text-loam hover:bg-rice-deep sm:border-transparent',
              )}
            >
              {tab.label}
              {tab.count ? (
                <span className="rounded-full bg-clay-deep px-2 text-sm font-extrabold text-rice">
                  {tab.count}
                  <span className="sr-only"> waiting</span>
                </span>
              ) : null}
            </button>
          );
        })}
      </div>
      <div role="tabpanel" id={`desk-panel-${current}`} aria-labelledby={`desk-tab-${current}`} tabIndex={0} className="pt-6 focus:outline-none focus-visible:outline-3">
        {/* The panel's own heading keeps the outline h1 → h2 → h3 for screen-reader navigation. */}
        <h2 className="sr-only">{tabs.find((t) => t.id === current)?.label}</h2>
        {children}
      </div>
    </div>
  );
}
