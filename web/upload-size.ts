/**
 * The page's check of a file's size against the service's upload limit,
 * before anything is sent, and its words for the refusal. Sizes in bytes;
 * shown in decimal MB (what a file manager shows) with the limit also in MiB
 * when it is a whole number of them (how the service states it).
 */

/** "812 bytes", "35.4 kB", "4.2 MB", "48 MB": decimal units, ≤ 3 significant figures. */
export function fileSizeText(bytes: number): string {
  if (bytes < 1000) return `${bytes} bytes`;
  const [value, unit] = bytes < 1e6 ? [bytes / 1e3, 'kB'] : bytes < 1e9 ? [bytes / 1e6, 'MB'] : [bytes / 1e9, 'GB'];
  return `${value < 100 ? Number(value.toFixed(1)) : Math.round(value)} ${unit}`;
}

const MIB = 1024 * 1024;

/** "10 MiB (10.5 MB)" for a whole number of MiB, else the decimal size alone. */
export function limitText(bytes: number): string {
  return bytes % MIB === 0 ? `${bytes / MIB} MiB (${fileSizeText(bytes)})` : fileSizeText(bytes);
}

/**
 * Why a file is not sent, or null when it may be: "big.csv is 48 MB; this
 * service accepts files up to 10 MiB (10.5 MB). It was not sent." Where the
 * rounded sizes would read the same, exact byte counts are given.
 */
export function oversizeMessage(name: string, size: number, limit: number | null): string | null {
  if (limit === null || size <= limit) return null;
  const close = fileSizeText(size) === fileSizeText(limit);
  const sizeText = close ? `${size} bytes` : fileSizeText(size);
  const limitWords = close ? `${limit} bytes` : limitText(limit);
  return `${name} is ${sizeText}; this service accepts files up to ${limitWords}. It was not sent.`;
}
