// The limiter's rules on a fake clock: failures count, successes do not, a
// locked account unlocks by itself once its failures leave the window.
import { describe, expect, it } from 'vitest';
import { HttpProblem } from '../http/problem';
import { SignInLimiter } from './sign-in-limits';

const WINDOW = 15 * 60_000;
function limiter(accountLimit = 3, addressLimit = 5) {
  let now = 1_000_000;
  const l = new SignInLimiter({ windowMs: WINDOW, accountLimit, addressLimit }, () => now);
  return { l, advance: (ms: number) => (now += ms) };
}
const refusal = (f: () => void) => {
  try {
    f();
    return null;
  } catch (err) {
    return err as HttpProblem;
  }
};

describe('SignInLimiter', () => {
  it('locks an account after its limit of failures, says so, and unlocks after the window', () => {
    const { l, advance } = limiter(3);
    for (let i = 0; i < 3; i++) {
      expect(refusal(() => l.check('Ada@Example.test', '10.0.0.1'))).toBeNull();
      l.failed('Ada@Example.test', `10.0.0.${i + 1}`);
    }
    const locked = refusal(() => l.check('ada@example.test', '10.9.9.9'));
    expect(locked?.status).toBe(429);
    expect(locked?.title).toBe('Account locked');
    expect(locked?.detail).toMatch(/locked after 3 failed sign-ins.*unlocks by itself in 15 minutes/);
    expect(refusal(() => l.check('someone-else@example.test', '10.0.0.1'))).toBeNull();
    advance(WINDOW - 1);
    expect(refusal(() => l.check('ada@example.test', '10.0.0.1'))?.status).toBe(429);
    advance(1);
    expect(refusal(() => l.check('ada@example.test', '10.0.0.1'))).toBeNull();
  });

  it('does not count successes, and a success clears the account', () => {
    const { l } = limiter(3, 5);
    for (let i = 0; i < 50; i++) l.succeeded(`user${i}@example.test`);
    expect(refusal(() => l.check('user0@example.test', '10.0.0.1'))).toBeNull();
    l.failed('bo@example.test', '10.0.0.1');
    l.failed('bo@example.test', '10.0.0.1');
    l.succeeded('bo@example.test');
    l.failed('bo@example.test', '10.0.0.1');
    l.failed('bo@example.test', '10.0.0.1');
    expect(refusal(() => l.check('bo@example.test', '10.0.0.2'))).toBeNull();
  });

  it('refuses an address over its ceiling of failures, across accounts', () => {
    const { l, advance } = limiter(100, 5);
    for (let i = 0; i < 5; i++) l.failed(`guess${i}@example.test`, '192.0.2.7');
    expect(refusal(() => l.check('new@example.test', '192.0.2.7'))?.title).toBe('Too many sign-in attempts');
    expect(refusal(() => l.check('new@example.test', '192.0.2.8'))).toBeNull();
    advance(WINDOW);
    expect(refusal(() => l.check('new@example.test', '192.0.2.7'))).toBeNull();
  });
});
