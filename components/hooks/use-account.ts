"use client";

import { useMutation } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api-fetch";
import type {
  ChangePasswordInput,
  ProfileNameInput,
  ResetConfirmInput,
  ResetRequestInput,
  SetPasswordInput,
  SignUpConfirmInput,
  SignUpInput,
} from "@/lib/auth/schemas";

// The account endpoints (app/api/auth, outside next-auth's own), one mutation each over apiFetch.
// A refusal rejects with ApiFetchError, whose field errors the forms put on their fields. Nothing
// here is cached: the signed-in pages read the account on the server.

type Message = { message: string };

/** Asks for an account: the answer is "check your mail" whether or not the address has one. */
export const useSignUp = () => useMutation({ mutationFn: (values: SignUpInput) => apiFetch<Message>("/api/auth/sign-up", { method: "POST", json: values }) });

/** Finishes a sign-up from the mailed link; answers the account's address so the page can sign in. */
export const useConfirmSignUp = () =>
  useMutation({
    mutationFn: (values: SignUpConfirmInput) => apiFetch<Message & { email: string }>("/api/auth/sign-up/confirm", { method: "POST", json: values }),
  });

export const useSaveName = () =>
  useMutation({ mutationFn: (values: ProfileNameInput) => apiFetch<{ user: { name: string } }>("/api/auth/profile", { method: "PATCH", json: values }) });

/** Change the password, or set a first one (the server knows which the account needs). */
export const useSavePassword = () =>
  useMutation({
    mutationFn: (values: ChangePasswordInput | SetPasswordInput) => apiFetch<Message>("/api/auth/profile/password", { method: "POST", json: values }),
  });

/** Ends every session of the account (every device, this one too). */
export const useSignOutEverywhere = () =>
  useMutation({ mutationFn: () => apiFetch<Message>("/api/auth/profile/sign-out-everywhere", { method: "POST", json: {} }) });

export const useRequestReset = () =>
  useMutation({ mutationFn: (values: ResetRequestInput) => apiFetch<Message>("/api/auth/password-reset", { method: "POST", json: values }) });

export const useCompleteReset = () =>
  useMutation({
    mutationFn: (values: ResetConfirmInput) => apiFetch<Message & { email: string }>("/api/auth/password-reset/complete", { method: "POST", json: values }),
  });
