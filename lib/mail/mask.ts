// What an administrator may read of a message: the secret parts of links (set-password tokens,
// personal calendar feed tokens) are masked, so reading mail never hands over someone else's
// account or calendar.
export function maskSecrets(text: string): string {
  return text
    .replace(/(\/set-password\?token=)[A-Za-z0-9_-]+/g, "$1••••••")
    .replace(/(\/api\/calendar\/)[A-Za-z0-9_-]{8,}/g, "$1••••••");
}
