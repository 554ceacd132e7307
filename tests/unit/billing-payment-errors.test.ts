// A failure of the payment service reaches the user as a message of our own; its raw text
// (which can name ids, keys or internals) goes to the server log only.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { callPayments, paymentsLog } from '@/lib/services/billing/common';
import { isAppError } from '@/lib/errors';

afterEach(() => vi.restoreAllMocks());

describe('payment service errors', () => {
  it('answers 502 with our own words and logs the raw text', async () => {
    const log = vi.spyOn(paymentsLog, 'error').mockImplementation(() => {});
    const raw = 'No such customer: cus_9XyZ; request req_abc123 (api key sk_test_...)';
    const failure = await callPayments('start the checkout', () => Promise.reject(new Error(raw))).catch(
      (e: unknown) => e,
    );
    expect(isAppError(failure)).toBe(true);
    if (!isAppError(failure)) return;
    expect(failure.status).toBe(502);
    expect(failure.code).toBe('payments_unavailable');
    expect(failure.message).toMatch(/^The payment service could not start the checkout/);
    expect(failure.message).not.toContain('cus_9XyZ');
    expect(failure.message).not.toContain('req_abc123');
    expect(log).toHaveBeenCalledWith(expect.objectContaining({ reason: raw }), expect.any(String));
  });

  it('passes a successful answer through unchanged', async () => {
    await expect(callPayments('read the subscription', async () => ({ id: 'sub_1' }))).resolves.toEqual({
      id: 'sub_1',
    });
  });
});
