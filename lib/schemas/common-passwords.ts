// Passwords of ten or more characters that appear near the top of published breach-frequency lists,
// plus obvious patterns. A short list is enough to stop the worst choices without shipping a large file.
const COMMON = new Set(
  [
    '1234567890', '12345678910', '0123456789', '1111111111', '0000000000', '9876543210', '1234512345', '1q2w3e4r5t',
    '1qaz2wsx3edc', 'qwertyuiop', 'asdfghjkl;', 'zxcvbnm123', 'qwerty1234', 'qwerty12345', 'qwertyuiop1', 'password12',
    'password123', 'password1234', 'password!1', 'passw0rd123', 'p@ssw0rd123', 'iloveyou12', 'iloveyou123', 'princess12',
    'sunshine123', 'football123', 'baseball123', 'welcome123', 'welcome1234', 'abc1234567', 'abcdefghij', 'abcd123456',
    'letmein123', 'changeme123', 'administrator', 'admin12345', 'admin123456', 'trustno1234', 'superman123', 'monkey12345',
    'dragon12345', 'master12345', 'starwars123', 'whatever123', 'computer123', 'internet123', 'qazwsxedcrfv', 'michael123',
    'jennifer123', 'charlie123', 'mustang123', 'shadow12345', 'liverpool1', 'chelsea123', 'arsenal123', 'pokemon123',
    'samsung123', 'google1234', 'tidewarden', 'tidewarden1', 'tidewarden123',
  ].map((p) => p.toLowerCase()),
);

export function isCommonPassword(password: string): boolean {
  const lower = password.toLowerCase();
  if (COMMON.has(lower)) return true;
  if (/^(.)\1+$/.test(password)) return true; // one character repeated
  if (/^\d+$/.test(password) && '01234567890123456789'.includes(password)) return true; // a run of digits
  return false;
}
