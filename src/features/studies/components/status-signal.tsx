import type { StudyStatus } from '@shared/schemas/studies';
import { Signal } from '@/components/signal';
import { statusLabels } from './format';

const tones = { draft: 'waiting', submitted: 'waiting', approved: 'good', returned: 'bad' } as const;

/** A study's review status in words (the colour only repeats them). */
export function StatusSignal({ status }: { status: StudyStatus }) {
  return <Signal tone={tones[status]}>{statusLabels[status]}</Signal>;
}
