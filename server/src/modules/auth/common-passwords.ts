// A small list of passwords of 10+ characters that are among the most used, refused at
// sign-up and password change. Compared case-insensitively.
export const commonPasswords = new Set([
  '1234567890', '0123456789', '12345678910', '123456789a', '1q2w3e4r5t', 'qwertyuiop', 'qwerty1234',
  'password12', 'password123', 'password1!', 'passw0rd123', 'iloveyou12', 'abcdefghij', 'abc1234567',
  'aaaaaaaaaa', '1111111111', '0000000000', '9876543210', 'asdfghjkl1', 'zxcvbnm123', 'letmein123',
  'welcome123', 'welcome2026', 'changeme123', 'football123', 'baseball123', 'superman12', 'princess12',
  'sunshine12', 'trustno1234', 'admin12345', 'administrator', 'qazwsxedcr', '1qaz2wsx3edc', 'q1w2e3r4t5',
  'pollination', 'honeybee123', 'beekeeper1', 'orchard123', 'password2026',
]);

export function isCommonPassword(password: string): boolean {
  return commonPasswords.has(password.trim().toLowerCase());
}
