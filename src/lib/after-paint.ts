import { useEffect, useState } from 'react';

/*
 * Charts wait until the screen has painted, then take one frame each. Creating a Chart.js chart
 * measures its container (a forced layout of the page just built) and draws every point; doing it
 * for all of a study's plots inside the render that first shows the screen made one main-thread
 * task of 250-370 ms on a 400-point study (npm run bench:study-screen). Now the screen paints first
 * and each chart is its own short task.
 */
let lastTurn: Promise<void> = Promise.resolve();

/** Resolves after the next frame has been drawn (or after 100 ms where no frames come, as in a hidden tab). */
function afterNextFrame(): Promise<void> {
  return new Promise((resolve) => {
    let done = false;
    const finish = () => {
      if (done) return;
      done = true;
      resolve();
    };
    // The timeout inside the frame callback runs once that frame is on screen.
    requestAnimationFrame(() => setTimeout(finish, 0));
    setTimeout(finish, 100);
  });
}

/** A turn after every turn asked for before it: one waiting chart per frame. */
function nextTurn(): Promise<void> {
  lastTurn = lastTurn.then(afterNextFrame);
  return lastTurn;
}

/** False on the first render, true once the page has painted and this caller's turn has come. */
export function useAfterPaint(): boolean {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let mounted = true;
    void nextTurn().then(() => {
      if (mounted) setReady(true);
    });
    return () => {
      mounted = false;
    };
  }, []);
  return ready;
}
