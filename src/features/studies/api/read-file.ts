import type { FileReading } from '@shared/schemas/file-reading';
import type { UploadMapping } from '@shared/schemas/study-uploads';
import { apiClient } from '@/lib/api-client';

/**
 * POST /api/labs/:labId/file-readings: reads an export for the preview of a study that does not
 * exist yet; the server keeps nothing. `mapping` reads it another way (columns, units, window).
 */
export function readFile(
  labId: string,
  file: File,
  mapping: UploadMapping | null,
  onProgress?: (fraction: number) => void,
): Promise<FileReading> {
  const form = new FormData();
  form.append('file', file);
  if (mapping) form.append('mapping', JSON.stringify(mapping));
  return apiClient.upload<FileReading>(`/api/labs/${labId}/file-readings`, form, onProgress);
}
