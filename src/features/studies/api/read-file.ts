import type { FileReading } from '@shared/schemas/file-reading';
import type { UploadMapping } from '@shared/schemas/study-uploads';
import { apiClient } from '@/lib/api-client';

/**
 * POST /api/labs/:labId/file-readings: reads an export for the preview of a study that does not
 * exist yet; the server keeps nothing. `mapping` reads it another way (columns, units, window);
 * `reading` is the emission window or wavelength typed for the study (nm, as typed), over which
 * spectra are proposed when no mapping is given.
 */
export function readFile(
  labId: string,
  file: File,
  mapping: UploadMapping | null,
  reading: { windowStart: string; windowEnd: string; emissionWavelength: string },
  onProgress?: (fraction: number) => void,
): Promise<FileReading> {
  const form = new FormData();
  form.append('file', file);
  if (mapping) form.append('mapping', JSON.stringify(mapping));
  for (const [name, value] of Object.entries(reading)) if (value.trim() !== '') form.append(name, value.trim());
  return apiClient.upload<FileReading>(`/api/labs/${labId}/file-readings`, form, onProgress);
}
