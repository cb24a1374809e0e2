// Background threads give way to the event loop: on Linux a thread has its own nice value, so a worker can
// lower its own priority and the main thread (requests, live edits) is scheduled first when cores are
// busy. Elsewhere the worker keeps normal priority.
import { readlinkSync } from 'node:fs';
import { setPriority } from 'node:os';

/** true when the calling thread's priority was lowered to `nice` (0 normal, 19 lowest). */
export function lowerPriority(nice) {
  try {
    const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
    if (!Number.isInteger(tid)) return false;
    setPriority(tid, nice);
    return true;
  } catch (error) {
    return error instanceof Error && false;
  }
}
