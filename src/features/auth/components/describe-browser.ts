const browsers: Array<[RegExp, string]> = [
  [/Edg\//, 'Edge'],
  [/Firefox\//, 'Firefox'],
  [/HeadlessChrome\//, 'Chromium (headless)'],
  [/Chrome\//, 'Chrome or Chromium'],
  [/Safari\//, 'Safari'],
];
const systems: Array<[RegExp, string]> = [
  [/Android/, 'Android'],
  [/iPhone|iPad/, 'iOS'],
  [/Mac OS X/, 'macOS'],
  [/Windows/, 'Windows'],
  [/Linux/, 'Linux'],
];

/** "Firefox on Linux" from a user-agent string, or a plain fallback for scripts and unknowns. */
export function describeBrowser(userAgent: string | null): string {
  if (!userAgent) return 'An unnamed program';
  const browser = browsers.find(([pattern]) => pattern.test(userAgent))?.[1];
  const system = systems.find(([pattern]) => pattern.test(userAgent))?.[1];
  if (!browser) return userAgent.slice(0, 60);
  return system ? `${browser} on ${system}` : browser;
}
