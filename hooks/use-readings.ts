import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiRequestError, apiRequest, errorFromResponse } from '@/lib/api-client';
import { tankKeys } from '@/lib/query-keys';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '@/shared/api-error';
import {
  importPreviewSchema,
  importResultSchema,
  readingPageSchema,
  type ImportPreview,
  type ImportResult,
  type ReadingCreateInput,
} from '@/shared/schemas/reading';
import { readingSchema } from '@/shared/schemas/tank';

/** Tests change when this person logs one; other devices' tests show up after 30 s. */
export const READINGS_STALE_MS = 30_000;
export const READINGS_PAGE_SIZE = 20;

const readingsUrl = (tankId: string) => `/api/tanks/${encodeURIComponent(tankId)}/readings`;

/** The export's address (a plain GET with the session cookie). */
export const readingsExportUrl = (tankId: string) => `${readingsUrl(tankId)}/export.csv`;

export function useReadingsPage(tankId: string, page: number, pageSize = READINGS_PAGE_SIZE) {
  return useQuery({
    queryKey: tankKeys.readings(tankId, page, pageSize),
    queryFn: ({ signal }) => apiRequest(`${readingsUrl(tankId)}?page=${page}&pageSize=${pageSize}`, { schema: readingPageSchema, signal }),
    staleTime: READINGS_STALE_MS,
    placeholderData: (previous) => previous,
  });
}

/** A new test changes the tank page, the home card and every test page. */
function useInvalidateTank() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: tankKeys.all });
}

export function useAddReading(tankId: string) {
  const invalidate = useInvalidateTank();
  return useMutation({
    mutationFn: (input: ReadingCreateInput) => apiRequest(readingsUrl(tankId), { method: 'POST', body: input, schema: readingSchema }),
    onSuccess: invalidate,
  });
}

export function useDeleteReading(tankId: string) {
  const invalidate = useInvalidateTank();
  return useMutation({
    mutationFn: (readingId: string) => apiRequest(`${readingsUrl(tankId)}/${encodeURIComponent(readingId)}`, { method: 'DELETE' }),
    onSuccess: invalidate,
  });
}

/** Sends a CSV file as multipart/form-data (the one non-JSON request the app makes). */
async function uploadCsv<T>(url: string, file: Blob, fileName: string, parse: (body: unknown) => T): Promise<T> {
  const form = new FormData();
  form.append('file', file, fileName);
  let response: Response;
  try {
    response = await fetch(url, { method: 'POST', body: form, credentials: 'same-origin', headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE, Accept: 'application/json' } });
  } catch {
    throw new ApiRequestError({ status: 0, code: 'network', message: 'Could not reach Shoalshift. Check your connection and try again.' });
  }
  if (!response.ok) throw await errorFromResponse(response);
  return parse(await response.json());
}

export interface CsvUpload {
  file: Blob;
  name: string;
}

export function useImportPreview(tankId: string) {
  return useMutation({
    mutationFn: ({ file, name }: CsvUpload): Promise<ImportPreview> =>
      uploadCsv(`${readingsUrl(tankId)}/import/preview`, file, name, (b) => importPreviewSchema.parse(b)),
  });
}

export function useImportCommit(tankId: string) {
  const invalidate = useInvalidateTank();
  return useMutation({
    mutationFn: ({ file, name }: CsvUpload): Promise<ImportResult> =>
      uploadCsv(`${readingsUrl(tankId)}/import/commit`, file, name, (b) => importResultSchema.parse(b)),
    onSuccess: invalidate,
  });
}
