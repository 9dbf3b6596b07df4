// TanStack Query hooks: the only place the desk's screens get their data from.
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Format } from "#core/nma/types";
import type { TranslationLocale } from "#core/languages/locales";
import type {
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
  ReviewBody,
  RescheduleBody,
  UploadReport,
  WithdrawalBody,
  SaveTranslationBody,
} from "#web/api/contract";
import { ApiError, call, forgetCsrfToken } from "./api";

/** Every query's key, in one place: a mutation invalidates exactly what it changed. */
export const queryKeys = {
  session: ["session"],
  briefs: ["briefs"],
  brief: (briefId: string) => ["brief", briefId],
  result: (outcomeId: string) => ["result", outcomeId],
  certainty: (outcomeId: string) => ["certainty", outcomeId],
  // Under the brief's key: whatever refreshes the brief (an upload, a saved text) refreshes these too.
  reviews: (briefId: string) => ["brief", briefId, "reviews"],
  readiness: (briefId: string) => ["brief", briefId, "readiness"],
  changes: (briefId: string) => ["brief", briefId, "changes"],
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
        return (await call("GET /api/session")).person;
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
    mutationFn: () => call("DELETE /api/session"),
    onSuccess: () => {
      forgetCsrfToken();
      queryClient.setQueryData(queryKeys.session, null);
    },
  });
}

/** `enabled`: false for a person who may not list the briefs (the press), so the desk never asks. */
export function useBriefs(enabled = true) {
  return useQuery({ queryKey: queryKeys.briefs, queryFn: async () => (await call("GET /api/briefs")).briefs, enabled });
}

export function useBrief(id: string) {
  return useQuery({
    queryKey: queryKeys.brief(id),
    queryFn: async () => (await call("GET /api/briefs/:id", { params: { id } })).brief,
    // While a large upload is analysed on the queue, ask again every two seconds until its result is in.
    refetchInterval: (query) => (query.state.data?.outcomes.some((o) => o.analysis.pending?.state === "analysing") ? 2000 : false),
  });
}

export function useCreateBrief() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: CreateBriefBody) => call("POST /api/briefs", { body: fields }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.briefs }),
  });
}

export function useCreateOutcome(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: CreateOutcomeBody) => call("POST /api/briefs/:id/outcomes", { params: { id: briefId }, body: fields }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

export function useUpdateOutcome(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fields: PatchOutcomeBody) => call("PATCH /api/outcomes/:id", { params: { id: outcomeId }, body: fields }),
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
    mutationFn: () => call("DELETE /api/outcomes/:id", { params: { id: outcomeId } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

/** Analyses the stored data again (a result of an earlier engine or settings is stale). */
export function useAnalyseAgain(briefId: string, outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => call("POST /api/outcomes/:id/analysis", { params: { id: outcomeId } }),
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
        return await call("PUT /api/outcomes/:id/dataset", { params: { id: outcomeId }, body: form });
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
  return useQuery({ queryKey: queryKeys.result(outcomeId), queryFn: () => call("GET /api/outcomes/:id/result", { params: { id: outcomeId } }) });
}

export function useCertainty(outcomeId: string) {
  return useQuery({
    queryKey: queryKeys.certainty(outcomeId),
    queryFn: async () => (await call("GET /api/outcomes/:id/certainty", { params: { id: outcomeId } })).comparisons,
  });
}

export function useSaveJudgement(outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ treatment, comparator, judgement }: { treatment: string; comparator: string; judgement: JudgementBody }) =>
      call("PUT /api/outcomes/:id/certainty/:treatment/:comparator", { params: { id: outcomeId, treatment, comparator }, body: judgement }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) }),
  });
}

/** Judgements of many pairs in one request: all saved, or none. */
export function useSaveJudgements(outcomeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (judgements: JudgementsBody["judgements"]) => call("PUT /api/outcomes/:id/certainty", { params: { id: outcomeId }, body: { judgements } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.certainty(outcomeId) }),
  });
}

export function useNameTreatments(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { names: Record<string, string>; grammar: Record<string, { phrase: string | null; number: "singular" | "plural" }> }) =>
      call("PUT /api/briefs/:id/treatments", { params: { id: briefId }, body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

/** The name readers see for a treatment label of the brief's data. */
export function useTreatmentName(briefId: string): (label: string) => string {
  const brief = useBrief(briefId);
  return (label) => brief.data?.treatments.find((t) => t.label === label)?.displayName ?? label;
}

export function previewMarkdown(markdown: string): Promise<string> {
  return call("POST /api/preview", { body: { markdown } }).then((r) => r.html);
}

/** Saves the editor's texts; a 409 means someone else saved first: the brief is reloaded to show their change. */
export function useSaveTexts(briefId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ rowVersion, ...texts }: { rowVersion: number; laySummary: string; shortTake: string }) =>
      call("PATCH /api/briefs/:id", { params: { id: briefId }, body: { rowVersion, ...texts } }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.brief(briefId) }),
  });
}

export function useReadiness(briefId: string) {
  return useQuery({ queryKey: queryKeys.readiness(briefId), queryFn: () => call("GET /api/briefs/:id/readiness", { params: { id: briefId } }) });
}

/** What publishing the draft would change since the last version (null before a first version). */
export function useDraftChanges(briefId: string, enabled: boolean) {
  return useQuery({ queryKey: queryKeys.changes(briefId), queryFn: () => call("GET /api/briefs/:id/changes", { params: { id: briefId } }), enabled });
}

export function useReviews(briefId: string) {
  return useQuery({ queryKey: queryKeys.reviews(briefId), queryFn: () => call("GET /api/briefs/:id/reviews", { params: { id: briefId } }) });
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
  return useReleaseStep(briefId, (body: ReviewBody) => call("POST /api/briefs/:id/reviews", { params: { id: briefId }, body }));
}

export function usePublish(briefId: string) {
  return useReleaseStep(briefId, (body: PublishBody) => call("POST /api/briefs/:id/versions", { params: { id: briefId }, body }));
}

export function useReschedule(briefId: string, version: number) {
  return useReleaseStep(briefId, (body: RescheduleBody) => call("PUT /api/briefs/:id/versions/:number/release", { params: { id: briefId, number: String(version) }, body }));
}

export function useWithdraw(briefId: string) {
  return useReleaseStep(briefId, (body: WithdrawalBody) => call("POST /api/briefs/:id/withdrawal", { params: { id: briefId }, body }));
}

export function usePressRoom() {
  return useQuery({ queryKey: queryKeys.pressRoom, queryFn: async () => (await call("GET /api/press-room")).versions });
}

export function usePeople() {
  return useQuery({ queryKey: queryKeys.people, queryFn: async () => (await call("GET /api/people")).people });
}

/** The e-mails and their states, asked again every two seconds while one is still waiting to be sent. */
export function useMessages() {
  return useQuery({
    queryKey: queryKeys.messages,
    queryFn: async () => (await call("GET /api/messages")).messages,
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

export const useInvite = () => usePeopleMutation((body: InviteBody) => call("POST /api/people", { body }));
export const useChangePerson = () => usePeopleMutation(({ id, ...body }: ChangePersonBody & { id: string }) => call("PATCH /api/people/:id", { params: { id }, body }));
export const useResendInvitation = () => usePeopleMutation((id: string) => call("POST /api/people/:id/invitation", { params: { id } }));

/** The audit log, newest first, a page at a time (the cursor is the last entry's id). */
export function useAudit(filter: Omit<AuditQuery, "before">) {
  return useInfiniteQuery({
    queryKey: queryKeys.audit(filter),
    initialPageParam: null as number | null,
    queryFn: ({ pageParam }) => {
      return call("GET /api/audit", { query: { ...filter, before: pageParam ?? undefined } });
    },
    getNextPageParam: (page) => page.next,
  });
}

/** The signed-in person's own name, time zone or password; the session's person is refreshed. */
export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AccountBody) => call("PATCH /api/account", { body }),
    onSuccess: ({ person }) => queryClient.setQueryData(queryKeys.session, person),
  });
}

export function useAskEditors() {
  return useMutation({ mutationFn: (body: PressEnquiryBody) => call("POST /api/press-enquiries", { body }) });
}

export function useTopics() {
  return useQuery({ queryKey: ["topics"], queryFn: async () => (await call("GET /api/topics")).topics });
}

/** The development mailbox (404 outside development, shown as the error). */
export function useDevMail() {
  return useQuery({
    queryKey: ["dev-mail"],
    queryFn: async () => (await call("GET /api/dev/mail")).messages,
    refetchInterval: 3000,
    retry: false,
  });
}

/** The translation desk's queue: each brief's newest version and the state of each language this person may translate. */
export function useTranslationQueue() {
  return useQuery({ queryKey: ["translations"], queryFn: () => call("GET /api/translations") });
}

/** `locale` comes from the desk's address as typed; the server answers 404 for one that is not a translation language. */
export function useTranslation(versionId: string, locale: string) {
  return useQuery({
    queryKey: ["translation", versionId, locale],
    queryFn: async () => (await call("GET /api/translations/:versionId/:locale", { params: { versionId, locale: locale as TranslationLocale } })).translation,
  });
}

/** Save, mark ready or publish: each answers with the translation as it now stands. */
export function useTranslationStep(versionId: string, locale: TranslationLocale) {
  const queryClient = useQueryClient();
  const params = { versionId, locale };
  return useMutation({
    mutationFn: (step: { save: SaveTranslationBody } | { ready: true } | { publish: true }) =>
      "save" in step
        ? call("PUT /api/translations/:versionId/:locale", { params, body: step.save })
        : "ready" in step ? call("POST /api/translations/:versionId/:locale/ready", { params }) : call("POST /api/translations/:versionId/:locale/publish", { params }),
    onSuccess: ({ translation }) => {
      queryClient.setQueryData(["translation", versionId, locale], translation);
      void queryClient.invalidateQueries({ queryKey: ["translations"] });
    },
  });
}
