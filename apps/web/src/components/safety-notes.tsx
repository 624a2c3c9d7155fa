import type { ReactNode } from 'react';
import { Panel } from './layouts/page.tsx';

/** The guild's standing safety and privacy notes; shown on the member's home page and wherever fabric is listed. */
export function SafetyNotes({ title = 'Guild safety notes' }: { title?: string }) {
  return (
    <Panel title={title}>
      <ul className="space-y-3">
        <SafetyNote icon={<PinIcon />}>
          <strong>Remove every pin and needle</strong> before you bag or post fabric.
        </SafetyNote>
        <SafetyNote icon={<NoIcon />}>
          <strong>No damaged fabric:</strong> nothing with mould, mildew, moth or smoke damage.
        </SafetyNote>
        <SafetyNote icon={<PawIcon />}>
          <strong>Say if pets live in your home.</strong> Some members have allergies.
        </SafetyNote>
        <SafetyNote icon={<LockIcon />}>
          <strong>Your address stays private.</strong> It is shown only to the other member of a paid order, never on a
          listing.
        </SafetyNote>
      </ul>
    </Panel>
  );
}

function SafetyNote({ icon, children }: { icon: ReactNode; children: ReactNode }) {
  return (
    <li className="flex gap-3">
      <span aria-hidden="true" className="mt-0.5 flex size-7 shrink-0 items-center justify-center text-madder">
        {icon}
      </span>
      <span>{children}</span>
    </li>
  );
}

// Drawn here rather than as emoji: tablets without an emoji font would show empty boxes.
const iconProps = { viewBox: '0 0 24 24', className: 'size-6', fill: 'none', stroke: 'currentColor', strokeWidth: 2, strokeLinecap: 'round', strokeLinejoin: 'round' } as const;

function PinIcon() {
  return (
    <svg {...iconProps}>
      <circle cx="8" cy="8" r="4" fill="currentColor" />
      <path d="M11 11l9 9" />
    </svg>
  );
}

function NoIcon() {
  return (
    <svg {...iconProps}>
      <circle cx="12" cy="12" r="9" />
      <path d="M5.6 5.6l12.8 12.8" />
    </svg>
  );
}

function PawIcon() {
  return (
    <svg {...iconProps} fill="currentColor" stroke="none">
      <ellipse cx="6" cy="10" rx="2" ry="2.6" />
      <ellipse cx="10" cy="5.5" rx="2" ry="2.6" />
      <ellipse cx="14.5" cy="5.5" rx="2" ry="2.6" />
      <ellipse cx="18.5" cy="10" rx="2" ry="2.6" />
      <path d="M12.2 11c-3 0-6 4.5-6 7 0 2 2 2.5 3 2.5 1.3 0 2-.8 3-.8s1.7.8 3 .8c1 0 3-.5 3-2.5 0-2.5-3-7-6-7z" />
    </svg>
  );
}

function LockIcon() {
  return (
    <svg {...iconProps}>
      <rect x="5" y="11" width="14" height="10" rx="2" />
      <path d="M8 11V8a4 4 0 0 1 8 0v3" />
    </svg>
  );
}
