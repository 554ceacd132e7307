import { describe, expect, it } from 'vitest';
import { clientAddress, trustedProxies, UNVERIFIED_ADDRESS } from '@/lib/auth/client-address';
import { safeCallbackPath, sameSiteRedirect } from '@/lib/auth/callback-url';
import { describeError } from '@/lib/http/log-error';
import { isForeignOrigin } from '@/lib/http/origin';
import { contentSecurityPolicy, strictTransportSecurity } from '@/lib/http/content-security';
import { emailSchema, signUpSchema } from '@/lib/validation/auth';

describe('client address for the per-address limits', () => {
  it('believes no forwarded header when no proxy is configured', () => {
    const none = trustedProxies('');
    expect(clientAddress('203.0.113.9', none)).toBe(UNVERIFIED_ADDRESS);
    expect(clientAddress('198.51.100.1, 203.0.113.9', none)).toBe(UNVERIFIED_ADDRESS);
    expect(clientAddress(null, none)).toBe(UNVERIFIED_ADDRESS);
  });

  it('reads right to left past the configured proxies, so a forged left part changes nothing', () => {
    const proxies = trustedProxies('10.0.0.2, 10.0.0.3');
    expect(clientAddress('203.0.113.9', proxies)).toBe('203.0.113.9');
    expect(clientAddress('1.1.1.1, 203.0.113.9, 10.0.0.2', proxies)).toBe('203.0.113.9');
    expect(clientAddress('2.2.2.2, 203.0.113.9, 10.0.0.2', proxies)).toBe('203.0.113.9');
    expect(clientAddress(['1.1.1.1, 203.0.113.9', '10.0.0.3'], proxies)).toBe('203.0.113.9');
  });

  it('spells one address one way', () => {
    const proxies = trustedProxies('127.0.0.1,::1');
    // An IPv4 peer seen on an IPv6 socket is written ::ffff:a.b.c.d (RFC 4291, section 2.5.5.2).
    expect(clientAddress('::ffff:127.0.0.1', proxies)).toBe('127.0.0.1');
    expect(clientAddress('2001:DB8::1, ::1', proxies)).toBe('2001:db8::1');
  });
});

describe('where sign-in may send the browser', () => {
  it.each([
    '//evil.example',
    '/\\evil.example',
    '/\\/evil.example',
    '/\t/evil.example',
    'https://evil.example',
    'javascript:alert(1)',
    '',
    null,
  ])('refuses %j', (value) => {
    expect(safeCallbackPath(value)).toBe('/projects');
  });

  it('keeps a path on this site with its query and fragment', () => {
    expect(safeCallbackPath('/invitations/abc?x=1#y')).toBe('/invitations/abc?x=1#y');
    expect(safeCallbackPath('/projects/12/items')).toBe('/projects/12/items');
  });

  it('turns next-auth redirects into URLs on the app', () => {
    const base = 'http://localhost:3000';
    expect(sameSiteRedirect('//evil.example', base)).toBe(`${base}/`);
    expect(sameSiteRedirect('/\\evil.example', base)).toBe(`${base}/`);
    expect(sameSiteRedirect('https://evil.example/projects', base)).toBe(base);
    expect(sameSiteRedirect(`${base}/projects/3`, base)).toBe(`${base}/projects/3`);
    expect(sameSiteRedirect('/sign-in', base)).toBe(`${base}/sign-in`);
  });
});

describe('what an unexpected error may log', () => {
  it('drops bound parameters and quoted values, and keeps the message, code and SQL shape', () => {
    const driver = Object.assign(
      new Error(
        "(conn:12, no: 1406, SQLState: 22001) Data too long for column 'email' at row 1\nsql: INSERT INTO `Users` (`email`,`passwordHash`) VALUES (?,?) - parameters:['x@y.example','$2b$10$abcdefghijk']",
      ),
      { code: 'ER_DATA_TOO_LONG' },
    );
    const wrapped = Object.assign(new Error(driver.message), {
      name: 'SequelizeDatabaseError',
      parent: driver,
      original: driver,
      sql: "SELECT * FROM `Invitations` WHERE `token` = 'secret-token-value'",
      parameters: { 1: 'secret-token-value', 2: '$2b$10$abcdefghijk' },
    });
    const logged = describeError(wrapped);
    const text = JSON.stringify(logged);
    expect(text).not.toContain('secret-token-value');
    expect(text).not.toContain('$2b$10$');
    expect(text).not.toContain('x@y.example');
    expect(logged.name).toBe('SequelizeDatabaseError');
    expect(logged.message).toMatch(/Data too long for column/);
    expect(logged.sql).toBe("SELECT * FROM `Invitations` WHERE `token` = '…'");
    expect(logged.cause?.code).toBe('ER_DATA_TOO_LONG');
    expect(logged).not.toHaveProperty('parameters');
  });
});

describe('cross-site requests', () => {
  const app = 'https://outturn.example';
  it('refuses a state-changing request from another origin', () => {
    expect(isForeignOrigin('POST', 'https://evil.example', 'outturn.example', app)).toBe(true);
    expect(isForeignOrigin('DELETE', 'null', 'outturn.example', app)).toBe(true);
    expect(isForeignOrigin('PATCH', 'https://outturn.example.evil.example', 'outturn.example', app)).toBe(
      true,
    );
  });
  it('lets the app’s own origin, reads, and requests without Origin through', () => {
    expect(isForeignOrigin('POST', 'https://outturn.example', 'internal:3000', app)).toBe(false);
    expect(isForeignOrigin('PUT', 'http://localhost:3100', 'localhost:3100', undefined)).toBe(false);
    expect(isForeignOrigin('GET', 'https://evil.example', 'outturn.example', app)).toBe(false);
    expect(isForeignOrigin('POST', null, 'outturn.example', app)).toBe(false);
  });
});

describe('security headers', () => {
  it('allows scripts only from the app or with the nonce, and no framing', () => {
    const policy = contentSecurityPolicy('abc123');
    expect(policy).toMatch(/script-src 'self' 'nonce-abc123'(;|$)/);
    expect(policy).not.toMatch(/script-src[^;]*unsafe/);
    expect(policy).toMatch(/frame-ancestors 'none'/);
  });
  it('sends HSTS only for an https address', () => {
    expect(strictTransportSecurity('https://outturn.example')).toMatch(/max-age=\d+/);
    expect(strictTransportSecurity('http://localhost:3000')).toBeNull();
  });
});

describe('e-mail length', () => {
  // 254 characters: the longest forward path SMTP carries (RFC 5321, 4.5.3.1.3, erratum 1690);
  // a local part of at most 64 and domain labels of at most 63 (RFC 5321, 4.5.3.1.1-2).
  const address = (length: number) => {
    const last = length - 64 - 1 - 64 - 64 - 4;
    return `${'a'.repeat(64)}@${'b'.repeat(63)}.${'c'.repeat(63)}.${'d'.repeat(last)}.com`;
  };

  it('accepts 254 characters and refuses 255 and 300 with a message naming the limit', () => {
    expect(address(254)).toHaveLength(254);
    expect(emailSchema.safeParse(address(254)).success).toBe(true);
    const over = emailSchema.safeParse(address(255));
    expect(over.success).toBe(false);
    expect(over.error?.issues[0].message).toMatch(/at most 254 characters/);
    const long = signUpSchema.safeParse({
      name: 'A',
      organizationName: 'AB',
      email: `${'a'.repeat(287)}@test.example`,
      password: 'long enough pw',
    });
    expect(long.success).toBe(false);
    expect(long.error?.issues[0]).toMatchObject({ path: ['email'], message: expect.stringMatching(/254/) });
  });
});
