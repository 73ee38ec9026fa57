/** Minimal files of the evidence types the server accepts. */
export const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
export const PDF = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n', 'latin1');
export const CSV = Buffer.from('reading_mm,temperature\n10.0012,20.1\n10.0015,20.2\noops,20.1\n10.0011,\n10.0013,20.0\n', 'utf8');
