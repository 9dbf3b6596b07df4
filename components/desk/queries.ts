// TanStack Query hooks: the only place the desk's screens get their data from.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ApiError, callApi, forgetCsrfToken, type SignedInPerson } from "./api";

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
