import { useId, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Input } from '../../../components/ui/field.tsx';
import { filterHandovers, groupHandovers } from '../handover-groups.ts';
import type { HandoverView } from '@scrap-relay/shared';
import { HandoverCard } from './handover-card.tsx';

type GroupBy = 'collector' | 'giver';

/** The on-screen list for the door: find a name, tick what changes hands. Grouped by who collects (they arrive asking) or who brings. */
export function DoorChecklist({ items, meetingId, viewerName }: { items: HandoverView[]; meetingId: string; viewerName: string }) {
  const [query, setQuery] = useState('');
  const [groupBy, setGroupBy] = useState<GroupBy>('collector');
  const searchId = useId();
  const groups = useMemo(() => groupHandovers(filterHandovers(items, query), groupBy), [items, query, groupBy]);

  return (
    <section aria-labelledby={`${searchId}-heading`} className="space-y-5 print:hidden">
      <h2 id={`${searchId}-heading`} className="text-2xl font-bold">
        Checklist for the door
      </h2>
      <div className="grid gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 sm:grid-cols-[2fr_auto] sm:items-end">
        <div className="space-y-1.5">
          <label htmlFor={searchId} className="block font-semibold">
            Find a name, reference or bundle
          </label>
          <Input id={searchId} type="search" value={query} autoComplete="off" onChange={(event) => setQuery(event.target.value)} />
        </div>
        <div role="group" aria-label="Group the list by" className="flex flex-wrap gap-2">
          <Button variant={groupBy === 'collector' ? 'primary' : 'secondary'} aria-pressed={groupBy === 'collector'} onClick={() => setGroupBy('collector')}>
            Who collects
          </Button>
          <Button variant={groupBy === 'giver' ? 'primary' : 'secondary'} aria-pressed={groupBy === 'giver'} onClick={() => setGroupBy('giver')}>
            Who brings
          </Button>
        </div>
      </div>

      {groups.length === 0 ? (
        <p className="text-lg">{query ? 'Nothing on this sheet matches that search.' : 'Nothing is due at this meeting.'}</p>
      ) : (
        groups.map((group) => (
          <section key={group.person.id || group.person.name} aria-label={`${group.person.name} ${groupBy === 'collector' ? 'collects' : 'brings'}`} className="space-y-3">
            <h3 className="border-b-2 border-thread pb-1 text-xl font-bold">
              {group.person.name}{' '}
              <span className="font-semibold text-thread-soft">
                {groupBy === 'collector' ? 'collects' : 'brings'} {group.handovers.length === 1 ? '1 handover' : `${group.handovers.length} handovers`}
              </span>
            </h3>
            <ul className="space-y-3">
              {group.handovers.map((handover) => (
                <li key={handover.id}>
                  <HandoverCard handover={handover} meetingId={meetingId} viewerName={viewerName} headingLevel="h4" />
                </li>
              ))}
            </ul>
          </section>
        ))
      )}
    </section>
  );
}
