import { useQuery } from '@tanstack/react-query';
import { appDb } from '../app/db';
import { engine } from '../workers/engineClient';
import { getModel, listModels, listReadings, listRuns } from '../store';

/** Queries the bench shares; keys carry the model version so edits refresh everything. */
export function useModels(projectId: string) {
  return useQuery({ queryKey: ['models', projectId], queryFn: () => listModels(appDb(), projectId) });
}

export function useModel(modelId: string | undefined) {
  return useQuery({ queryKey: ['model', modelId], queryFn: () => getModel(appDb(), modelId!), enabled: !!modelId });
}

export function useSummary(modelId: string | undefined, version: number | undefined) {
  return useQuery({ queryKey: ['summary', modelId, version], queryFn: () => engine().summary(modelId!), enabled: !!modelId && version !== undefined });
}

export function useSketch(modelId: string | undefined, version: number | undefined) {
  return useQuery({ queryKey: ['sketch', modelId, version], queryFn: () => engine().sketch(modelId!), enabled: !!modelId && version !== undefined });
}

export function useRuns(modelId: string | undefined) {
  return useQuery({ queryKey: ['runs', modelId], queryFn: () => listRuns(appDb(), modelId!), enabled: !!modelId });
}

export function useReadings(modelId: string | undefined) {
  return useQuery({ queryKey: ['readings', modelId], queryFn: () => listReadings(appDb(), modelId!), enabled: !!modelId });
}
