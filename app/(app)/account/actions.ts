"use server";

import { perform } from "@/lib/actions/request";
import { changePassword } from "@/lib/auth/account";
import type { ActionState } from "@/components/forms/action-form";

/** Change the password (current one required). Every older session, this one included, stops counting. */
export async function changePasswordAction(_prev: ActionState, form: FormData) {
  return perform(changePassword, form);
}
