// TanStack Query hooks: the only place the desk's screens get their data from.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ComparisonCertainty, ComparisonJudgement } from "../../server/grade/assess";
import type { PressRoomEntry } from "../../server/briefs/versions";
import type { AnalysisResult } from "../../server/nma/analyse";
import { ApiError, callApi, forgetCsrfToken, type SignedInPerson } from "./api";
import type { BriefDetail, BriefSummary, Format, UploadReport } from "./types";

/** The signed-in person, or null when nobody is (a 401 is an answer here, not an error). */
export function useSignedInPerson() {
  return useQuery({
    queryKey: ["session"],
    queryFn: async () => {
      try {
        return (await callApi<{ person: SignedInPerson }>("GET", "/api/session")).person;
      } catch (error) {
        if (error instanceof ApiError && error.status === 401) return null;
        throw error;
      }
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => callApi<void>("DELETE", "/api/session"),
    onSuccess: () => {
      forgetCsrfToken();
      queryClient.setQueryData(["session"], null);
    },
  });
}

export function useBriefs() {
  return useQuery({ queryKey: ["briefs"], queryFn: async () => (await callApi<{ briefs: BriefSummary[] }>("GET", "/api/briefs")).briefs });
}

export function useBrief(id: string) {
  return useQuery({ queryKey: ["brief", id], queryFn: async () => (await callApi<{ brief: BriefDetail }>("GET", `/api/briefs/${id}`)).brief });
}

export function useCreateBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: { title: string; topic: string; condition: string; population: string }) =>
      callApi<{ id: string; slug: string }>("POST", "/api/briefs", fields),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["briefs"] }),
  });
}

export function useCreateOutcome(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: Record<string, unknown>) => callApi("POST", `/api/briefs/${briefId}/outcomes`, fields),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["brief", briefId] }),
  });
}

/** A rejected file is an answer, not a failure: its report comes back either way. */
export function useUploadDataset(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, format }: { file: File; format: Format }): Promise<UploadReport> => {
      const form = new FormData();
      form.set("format", format);
      form.set("file", file);
      try {
        return await callApi<UploadReport>("PUT", `/api/outcomes/${outcomeId}/dataset`, form);
      } catch (error) {
        if (error instanceof ApiError && error.status === 422) return error.payload as UploadReport;
        throw error;
      }
    },
    onSuccess: (report) => {
      if (report.valid) {
        void queryClient.invalidateQueries({ queryKey: ["brief", briefId] });
        void queryClient.invalidateQueries({ queryKey: ["result", outcomeId] });
      }
    },
  });
}

export function useResult(outcomeId: string) {
  return useQuery({ queryKey: ["result", outcomeId], queryFn: () => callApi<AnalysisResult>("GET", `/api/outcomes/${outcomeId}/result`) });
}

export function useCertainty(outcomeId: string) {
  return useQuery({
    queryKey: ["certainty", outcomeId],
    queryFn: async () => (await callApi<{ comparisons: ComparisonCertainty[] }>("GET", `/api/outcomes/${outcomeId}/certainty`)).comparisons,
  });
}

export function useSaveJudgement(outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ treatment, comparator, judgement }: { treatment: string; comparator: string; judgement: ComparisonJudgement }) =>
      callApi("PUT", `/api/outcomes/${outcomeId}/certainty/${encodeURIComponent(treatment)}/${encodeURIComponent(comparator)}`, judgement),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["certainty", outcomeId] }),
  });
}

export function useNameTreatments(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (names: Record<string, string>) => callApi("PUT", `/api/briefs/${briefId}/treatments`, { names }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["brief", briefId] }),
  });
}

/** The name readers see for a treatment label of the brief's data. */
export function useTreatmentName(briefId: string): (label: string) => string {
  const brief = useBrief(briefId);
  return (label) => brief.data?.treatments.find((t) => t.label === label)?.displayName ?? label;
}

export function previewMarkdown(markdown: string): Promise<string> {
  return callApi<{ html: string }>("POST", "/api/preview", { markdown }).then((r) => r.html);
}

/** Saves the editor's texts; a 409 means someone else saved first: the brief is reloaded to show their change. */
export function useSaveTexts(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ rowVersion, ...texts }: { rowVersion: number; laySummary: string; keyMessages: string }) =>
      callApi("PATCH", `/api/briefs/${briefId}`, { rowVersion, ...texts }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ["brief", briefId] }),
  });
}

export interface ReviewHistory {
  steps: { decision: "submitted" | "returned" | "approved"; comment: string | null; createdAt: string; actorId: string; actorName: string }[];
  approval: "none" | "current" | "stale";
}

export function useReviews(briefId: string) {
  return useQuery({ queryKey: ["reviews", briefId], queryFn: () => callApi<ReviewHistory>("GET", `/api/briefs/${briefId}/reviews`) });
}

/** Review, publishing and withdrawal all change the brief's status and its review history. */
function useReleaseStep<T, R>(briefId: string, step: (body: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: step,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: ["brief", briefId] }),
        queryClient.invalidateQueries({ queryKey: ["reviews", briefId] }),
        queryClient.invalidateQueries({ queryKey: ["briefs"] }),
      ]);
    },
  });
}

export function useReviewStep(briefId: string) {
  return useReleaseStep(briefId, (body: { decision: "submitted" | "returned" | "approved"; comment?: string }) => callApi("POST", `/api/briefs/${briefId}/reviews`, body));
}

export function usePublish(briefId: string) {
  return useReleaseStep(briefId, (body: { releaseAt?: string; note?: string }) => callApi<{ version: number; url: string }>("POST", `/api/briefs/${briefId}/versions`, body));
}

export function useWithdraw(briefId: string) {
  return useReleaseStep(briefId, (body: { reason: string }) => callApi("POST", `/api/briefs/${briefId}/withdrawal`, body));
}

export function usePressRoom() {
  return useQuery({ queryKey: ["press-room"], queryFn: async () => (await callApi<{ versions: PressRoomEntry[] }>("GET", "/api/press-room")).versions });
}
