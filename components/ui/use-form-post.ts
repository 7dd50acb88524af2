"use client";
/** A form's POST: sends JSON, keeps the server's field errors and message, refreshes one query on success. */
import { useMutation, useQueryClient, type QueryKey } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson, fieldErrorsOf } from "./fetch-json";

export function useFormPost<B>(url: string, refresh: QueryKey) {
  const qc = useQueryClient();
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const mutation = useMutation({
    mutationFn: (body: B) => fetchJson(url, { method: "POST", body: JSON.stringify(body) }),
    onSuccess: () => {
      setErrors({});
      setMessage(null);
      return qc.invalidateQueries({ queryKey: refresh });
    },
    onError: (err) => {
      setErrors(fieldErrorsOf(err));
      setMessage((err as Error).message);
    },
  });
  return { mutation, errors, message, setErrors, setMessage };
}
