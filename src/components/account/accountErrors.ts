// The errors of an account form's fields, given by AccountForm to the AccountInputs in it.
import type { InjectionKey, Ref } from 'vue';

export const ACCOUNT_ERRORS: InjectionKey<Readonly<Ref<Record<string, string>>>> = Symbol('account form errors');
