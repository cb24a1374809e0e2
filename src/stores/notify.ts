// The one notifier: every store reports success and failure through here, so messages look alike.
import { defineStore } from 'pinia';
import { Notify } from 'quasar';
import { ApiError } from '@/api/http.ts';

/** A message a person can act on, from whatever was thrown. */
export function describeError(e: unknown): string {
  if (e instanceof ApiError) return e.message;
  if (e instanceof Error) return e.message;
  return String(e);
}

/** The API's 404: the thing is gone or was never shared with this person, so trying again cannot help. */
export const isNotFound = (e: unknown): boolean => e instanceof ApiError && e.status === 404;

export const useNotifyStore = defineStore('notify', () => {
  function success(message: string): void {
    Notify.create({ type: 'positive', message });
  }
  function info(message: string): void {
    Notify.create({ type: 'info', message });
  }
  /** Reports a failure; a 401 is left to the auth store, which signs out instead. */
  function error(e: unknown, context?: string): void {
    if (e instanceof ApiError && e.status === 401) return;
    const message = context ? `${context}: ${describeError(e)}` : describeError(e);
    Notify.create({ type: 'negative', message, timeout: 6000 });
  }
  return { success, info, error };
});
