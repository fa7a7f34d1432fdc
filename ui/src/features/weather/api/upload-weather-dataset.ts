import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WeatherDatasetUpload, WeatherImportJob, WeatherImportResult } from '@beamwright/link-core/contracts';
import { uploadForm } from '@/lib/api-client';
import { weatherKeys } from '@/lib/query-keys';

export interface WeatherUploadInput {
  file: File;
  fields: WeatherDatasetUpload;
  /** bytes sent so far of the whole request, and its size */
  onUploadProgress?: (sentBytes: number, totalBytes: number) => void;
}

/** 201 with the result (the import was quick), or 202 with the job to follow. */
export type WeatherUploadAnswer = { kind: 'imported'; result: WeatherImportResult } | { kind: 'queued'; job: WeatherImportJob };

/**
 * The multipart upload of POST /api/weather-datasets. It asks for 202 at once (`Prefer:
 * respond-async`) so the page can show the processing progress of the job.
 */
export async function uploadWeatherDataset({ file, fields, onUploadProgress }: WeatherUploadInput): Promise<WeatherUploadAnswer> {
  const form = new FormData();
  form.set('name', fields.name);
  if (fields.notes) form.set('notes', fields.notes);
  if (fields.siteId) form.set('siteId', fields.siteId);
  form.set('mapping', JSON.stringify(fields.mapping));
  form.set('onRowErrors', fields.onRowErrors ?? 'reject');
  form.set('file', file, file.name);
  const answer = await uploadForm<WeatherImportResult | WeatherImportJob>('/weather-datasets', form, { onUploadProgress, headers: { Prefer: 'respond-async' } });
  return answer.status === 202 ? { kind: 'queued', job: answer.body as WeatherImportJob } : { kind: 'imported', result: answer.body as WeatherImportResult };
}

export function useUploadWeatherDataset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadWeatherDataset,
    onSuccess: (answer) => {
      // the job as the 202 gave it: its progress shows before the first poll
      if (answer.kind === 'queued') queryClient.setQueryData(weatherKeys.import(answer.job.jobId), answer.job);
      return queryClient.invalidateQueries({ queryKey: weatherKeys.datasets() });
    },
  });
}
