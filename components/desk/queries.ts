// TanStack Query hooks: the only place the desk's screens get their data from.
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Format } from "#core/nma/types";
import type {
  ApiAnswers,
  AuditQuery,
  AccountBody,
  PressEnquiryBody,
  ChangePersonBody,
  InviteBody,
  CreateBriefBody,
  CreateOutcomeBody,
  JudgementBody,
  JudgementsBody,
  PatchOutcomeBody,
  PublishBody,
  Result,
  ReviewBody,
  RescheduleBody,
  ReviewHistory,
  UploadReport,
  WithdrawalBody,
  SaveTranslationBody,
} from "#web/api/contract";
import { ApiError, callApi, forgetCsrfToken } from "./api";

/** Every query's key, in one place: a mutation invalidates exactly what it changed. */
export const queryKeys = {
  session: ["session"],
  briefs: ["briefs"],
  brief: (briefId: string) => ["brief", briefId],
  result: (outcomeId: string) => ["result", outcomeId],
  certainty: (outcomeId: string) => ["certainty", outcomeId],
  reviews: (briefId: string) => ["reviews", briefId],
  readiness: (briefId: string) => ["readiness", briefId],
  pressRoom: ["press-room"],
  people: ["people"],
  messages: ["messages"],
  audit: (filter: AuditQuery) => ["audit", filter],
} as const;

/** The signed-in person, or null when nobody is (a 401 is an answer here, not an error). */
export function useSignedInPerson() {
  return useQuery({
    queryKey: queryKeys.session,
    queryFn: async () => {
      try {
        return (await callApi<ApiAnswers["session"]>("GET", "/api/session")).person;
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
      queryClient.setQueryData(queryKeys.session, null);
    },
  });
}

export function useBriefs() {
  return useQuery({ queryKey: queryKeys.briefs, queryFn: async () => (await callApi<ApiAnswers["briefs"]>("GET", "/api/briefs")).briefs });
}

export function useBrief(id: string) {
  return useQuery({
    queryKey: queryKeys.brief(id),
    queryFn: async () => (await callApi<ApiAnswers["brief"]>("GET", `/api/briefs/${id}`)).brief,
    // While a large upload is analysed on the queue, ask again every two seconds until its result is in.
    refetchInterval: (query) => (query.state.data?.outcomes.some((o) => o.analysis.pending?.state === "analysing") ? 2000 : false),
  });
}

export function useCreateBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: CreateBriefBody) => callApi<ApiAnswers["createdBrief"]>("POST", "/api/briefs", fields),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.briefs }),
  });
}

export function useCreateOutcome(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: CreateOutcomeBody) => callApi<ApiAnswers["outcome"]>("POST", `/api/briefs/${briefId}/outcomes`, fields),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

export function useUpdateOutcome(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: PatchOutcomeBody) => callApi<ApiAnswers["outcome"]>("PATCH", `/api/outcomes/${outcomeId}`, fields),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.result(outcomeId) });
    },
  });
}

export function useDeleteOutcome(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => callApi<void>("DELETE", `/api/outcomes/${outcomeId}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

/** Analyses the stored data again (a result of an earlier engine or settings is stale). */
export function useAnalyseAgain(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => callApi<{ resultId: string }>("POST", `/api/outcomes/${outcomeId}/analysis`),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.result(outcomeId) });
    },
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
        void queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) });
        void queryClient.invalidateQueries({ queryKey: queryKeys.result(outcomeId) });
      }
    },
  });
}

export function useResult(outcomeId: string) {
  return useQuery({ queryKey: queryKeys.result(outcomeId), queryFn: () => callApi<Result>("GET", `/api/outcomes/${outcomeId}/result`) });
}

export function useCertainty(outcomeId: string) {
  return useQuery({
    queryKey: queryKeys.certainty(outcomeId),
    queryFn: async () => (await callApi<ApiAnswers["certainty"]>("GET", `/api/outcomes/${outcomeId}/certainty`)).comparisons,
  });
}

export function useSaveJudgement(outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ treatment, comparator, judgement }: { treatment: string; comparator: string; judgement: JudgementBody }) =>
      callApi<ApiAnswers["judged"]>("PUT", `/api/outcomes/${outcomeId}/certainty/${encodeURIComponent(treatment)}/${encodeURIComponent(comparator)}`, judgement),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) }),
  });
}

/** Judgements of many pairs in one request: all saved, or none. */
export function useSaveJudgements(outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (judgements: JudgementsBody["judgements"]) => callApi<ApiAnswers["judgedMany"]>("PUT", `/api/outcomes/${outcomeId}/certainty`, { judgements }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) }),
  });
}

export function useNameTreatments(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { names: Record<string, string>; grammar: Record<string, { phrase: string | null; number: "singular" | "plural" }> }) =>
      callApi<ApiAnswers["treatments"]>("PUT", `/api/briefs/${briefId}/treatments`, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

/** The name readers see for a treatment label of the brief's data. */
export function useTreatmentName(briefId: string): (label: string) => string {
  const brief = useBrief(briefId);
  return (label) => brief.data?.treatments.find((t) => t.label === label)?.displayName ?? label;
}

export function previewMarkdown(markdown: string): Promise<string> {
  return callApi<ApiAnswers["preview"]>("POST", "/api/preview", { markdown }).then((r) => r.html);
}

/** Saves the editor's texts; a 409 means someone else saved first: the brief is reloaded to show their change. */
export function useSaveTexts(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ rowVersion, ...texts }: { rowVersion: number; laySummary: string; shortTake: string }) =>
      callApi<ApiAnswers["patchedBrief"]>("PATCH", `/api/briefs/${briefId}`, { rowVersion, ...texts }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

export function useReadiness(briefId: string) {
  return useQuery({ queryKey: queryKeys.readiness(briefId), queryFn: () => callApi<ApiAnswers["readiness"]>("GET", `/api/briefs/${briefId}/readiness`) });
}

export function useReviews(briefId: string) {
  return useQuery({ queryKey: queryKeys.reviews(briefId), queryFn: () => callApi<ReviewHistory>("GET", `/api/briefs/${briefId}/reviews`) });
}

/** Review, publishing and withdrawal all change the brief's status and its review history. */
function useReleaseStep<T, R>(briefId: string, step: (body: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: step,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.reviews(briefId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.readiness(briefId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.briefs }),
      ]);
    },
  });
}

export function useReviewStep(briefId: string) {
  return useReleaseStep(briefId, (body: ReviewBody) => callApi<ApiAnswers["reviewStep"]>("POST", `/api/briefs/${briefId}/reviews`, body));
}

export function usePublish(briefId: string) {
  return useReleaseStep(briefId, (body: PublishBody) => callApi<ApiAnswers["published"]>("POST", `/api/briefs/${briefId}/versions`, body));
}

export function useReschedule(briefId: string, version: number) {
  return useReleaseStep(briefId, (body: RescheduleBody) => callApi<ApiAnswers["rescheduled"]>("PUT", `/api/briefs/${briefId}/versions/${version}/release`, body));
}

export function useWithdraw(briefId: string) {
  return useReleaseStep(briefId, (body: WithdrawalBody) => callApi<ApiAnswers["withdrawn"]>("POST", `/api/briefs/${briefId}/withdrawal`, body));
}

export function usePressRoom() {
  return useQuery({ queryKey: queryKeys.pressRoom, queryFn: async () => (await callApi<ApiAnswers["pressRoom"]>("GET", "/api/press-room")).versions });
}

export function usePeople() {
  return useQuery({ queryKey: queryKeys.people, queryFn: async () => (await callApi<ApiAnswers["people"]>("GET", "/api/people")).people });
}

/** The e-mails and their states, asked again every two seconds while one is still waiting to be sent. */
export function useMessages() {
  return useQuery({
    queryKey: queryKeys.messages,
    queryFn: async () => (await callApi<ApiAnswers["messages"]>("GET", "/api/messages")).messages,
    refetchInterval: (query) => (query.state.data?.some((message) => message.state === "queued") ? 2000 : false),
  });
}

/** Invitations, changes and re-sent invitations: each refreshes the people and the messages. */
function usePeopleMutation<T>(call: (input: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: call,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: queryKeys.people }), queryClient.invalidateQueries({ queryKey: queryKeys.messages })]),
  });
}

export const useInvite = () => usePeopleMutation((body: InviteBody) => callApi<ApiAnswers["person"]>("POST", "/api/people", body));
export const useChangePerson = () => usePeopleMutation(({ id, ...body }: ChangePersonBody & { id: string }) => callApi<ApiAnswers["person"]>("PATCH", `/api/people/${id}`, body));
export const useResendInvitation = () => usePeopleMutation((id: string) => callApi<unknown>("POST", `/api/people/${id}/invitation`));

/** The audit log, newest first, a page at a time (the cursor is the last entry's id). */
export function useAudit(filter: Omit<AuditQuery, "before">) {
  return useInfiniteQuery({
    queryKey: queryKeys.audit(filter),
    initialPageParam: null as number | null,
    queryFn: ({ pageParam }) => {
      const query = new URLSearchParams(Object.entries({ ...filter, before: pageParam ?? undefined }).filter(([, v]) => v !== undefined && v !== "").map(([k, v]) => [k, String(v)]));
      return callApi<ApiAnswers["audit"]>("GET", `/api/audit?${query}`);
    },
    getNextPageParam: (page) => page.next,
  });
}

/** The signed-in person's own name, time zone or password; the session's person is refreshed. */
export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AccountBody) => callApi<ApiAnswers["session"]>("PATCH", "/api/account", body),
    onSuccess: ({ person }) => queryClient.setQueryData(queryKeys.session, person),
  });
}

export function useAskEditors() {
  return useMutation({ mutationFn: (body: PressEnquiryBody) => callApi<unknown>("POST", "/api/press-enquiries", body) });
}

export function useTopics() {
  return useQuery({ queryKey: ["topics"], queryFn: async () => (await callApi<ApiAnswers["topics"]>("GET", "/api/topics")).topics });
}

/** The development mailbox (404 outside development, shown as the error). */
export function useDevMail() {
  return useQuery({
    queryKey: ["dev-mail"],
    queryFn: async () => (await callApi<{ messages: { to: string; subject: string; text: string; receivedAt: string }[] }>("GET", "/api/dev/mail")).messages,
    refetchInterval: 3000,
    retry: false,
  });
}

/** The translation desk's queue: each brief's newest version and the state of each language this person may translate. */
export function useTranslationQueue() {
  return useQuery({ queryKey: ["translations"], queryFn: () => callApi<ApiAnswers["translationQueue"]>("GET", "/api/translations") });
}

export function useTranslation(versionId: string, locale: string) {
  return useQuery({
    queryKey: ["translation", versionId, locale],
    queryFn: async () => (await callApi<ApiAnswers["translation"]>("GET", `/api/translations/${versionId}/${locale}`)).translation,
  });
}

/** Save, mark ready or publish: each answers with the translation as it now stands. */
export function useTranslationStep(versionId: string, locale: string) {
  const queryClient = useQueryClient();
  const path = `/api/translations/${versionId}/${locale}`;
  return useMutation({
    mutationFn: (step: { save: SaveTranslationBody } | { ready: true } | { publish: true }) =>
      "save" in step
        ? callApi<ApiAnswers["translation"]>("PUT", path, step.save)
        : callApi<ApiAnswers["translation"]>("POST", `${path}/${"ready" in step ? "ready" : "publish"}`),
    onSuccess: ({ translation }) => {
      queryClient.setQueryData(["translation", versionId, locale], translation);
      void queryClient.invalidateQueries({ queryKey: ["translations"] });
    },
  });
}
