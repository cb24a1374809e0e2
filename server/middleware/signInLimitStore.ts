// The sign-in limit's counter in Redis, shared by every process (rate-limit-redis), made to fail safe
// when Redis is away (docs/faults.md): each command is bounded in time and a failure answers 503
// `unavailable` at once, never a crash, a 500 or a long wait. A sign-in is refused rather than let
// through uncounted, so losing Redis never lifts the limit on password guessing.
import type { Options } from 'express-rate-limit';
import { RedisStore } from 'rate-limit-redis';
import type { RedisClient } from '../context.ts';
import { unavailable as unavailableError } from '../errors.ts';
import { boundedCommand } from '../redis.ts';

type SendCommand = Extract<ConstructorParameters<typeof RedisStore>[0], { sendCommand: unknown }>['sendCommand'];

/**
 * RedisStore keeps the promise of its script load from start-up; when Redis was away then, that
 * promise stays rejected for ever. This store loads the scripts again after a failed load.
 */
class RecoveringRedisStore extends RedisStore {
  private loadFailed = false;

  private loadScripts(): void {
    this.loadFailed = false;
    const flag = () => {
      this.loadFailed = true;
    };
    this.incrementScriptSha = this.loadIncrementScript();
    this.getScriptSha = this.loadGetScript();
    this.incrementScriptSha.catch(flag);
    this.getScriptSha.catch(flag);
  }

  override async init(options: Options): Promise<void> {
    this.windowMs = options.windowMs;
    this.loadScripts();
  }

  override async increment(key: string) {
    if (this.loadFailed) this.loadScripts();
    return super.increment(key);
  }

  override async get(key: string) {
    if (this.loadFailed) this.loadScripts();
    return super.get(key);
  }
}

/** `what`: the action refused while the counter is away, named in the 503 ("Sign-in", "Registration"…). */
export function signInLimitStore(redis: RedisClient, prefix: string, what = 'Sign-in'): RedisStore {
  const unavailable = () =>
    unavailableError(
      `${what} is briefly unavailable (the shared counter cannot be reached); try again in a minute`,
      30,
    );
  const sendCommand = (...args: string[]) =>
    boundedCommand(redis, () => redis.sendCommand(args), unavailable) as ReturnType<SendCommand>;
  return new RecoveringRedisStore({ sendCommand, prefix });
}
