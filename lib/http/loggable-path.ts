// A request's path as the log may keep it. Invitation and password-reset links carry their
// secret token in the path; a log line must not become a way in, so any long opaque segment
// (record ids are short numbers) is replaced.

// Base64url or hex, 20 characters or more: the shape of a random token. Record ids are short
// numbers and the API's own path words are all under 16 characters.
const TOKEN_SEGMENT = /^[A-Za-z0-9_-]{20,}$/;

export function loggablePath(pathname: string): string {
  return pathname
    .split('/')
    .map((segment) => (TOKEN_SEGMENT.test(segment) ? ':token' : segment))
    .join('/');
}
