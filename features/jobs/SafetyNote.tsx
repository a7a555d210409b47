import { Notice } from '../ui/Notice';
import type { JobStatus } from './schema';

/** The usual cautions for the stage the job is in; the shop's own practice and local codes come first. */
const cautions: Partial<Record<JobStatus, { title: string; text: string }>> = {
  cutting: {
    title: 'Blades',
    text: 'Cut away from your body, retract the blade when you stop, replace dull blades instead of pressing harder, and put used blades in a sharps container, following your shop’s safety practice and local rules.',
  },
  assembling: {
    title: 'Glazing',
    text: 'Handle glass with gloves and eye protection, carry sheets on edge, and never gather broken glass by hand: sweep it up, wrap it in thick card, mark the bundle as broken glass and dispose of it as local rules require. Prefer acrylic for a frame that will be shipped.',
  },
  ready: {
    title: 'Hanging',
    text: 'Tell the customer to hang a heavy shadowbox from two hangers into studs or anchors rated for at least twice its weight, following local building practice.',
  },
  shipped: {
    title: 'Shipping',
    text: 'Ship with acrylic rather than glass where you can; if glass must travel, tape it and pack it so it cannot flex. Follow the carrier’s rules for fragile goods.',
  },
};

export function SafetyNote({ status }: { status: JobStatus }) {
  const caution = cautions[status];
  if (!caution) return null;
  return (
    <Notice tone="info" title={`Safety: ${caution.title.toLowerCase()}`}>
      {caution.text}
    </Notice>
  );
}
