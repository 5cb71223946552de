import { useState } from 'react';
import type { ReactNode } from 'react';

const key = (userId: string, labId: string) => `halflight.cautions-read.${userId}.${labId}`;
const wasRead = (userId: string, labId: string) => {
  try {
    return window.localStorage.getItem(key(userId, labId)) === 'yes';
  } catch {
    return false;
  }
};

/**
 * The usual cautions open the first time a person opens a study in a lab, then stay one click
 * away ("Safety reminders") instead of standing above every study.
 */
export function CautionsOnce({ userId, labId, children }: { userId: string; labId: string; children: ReactNode }) {
  const [open] = useState(() => !wasRead(userId, labId));
  return (
    <details
      open={open}
      onToggle={() => {
        try {
          window.localStorage.setItem(key(userId, labId), 'yes');
        } catch {
          // Without storage they simply open again next time.
        }
      }}
      className="rounded-card border border-glow-300 bg-glow-50 px-4 py-2"
    >
      <summary className="cursor-pointer text-body font-bold text-glow-700">Safety reminders</summary>
      <div className="mt-2">{children}</div>
    </details>
  );
}
