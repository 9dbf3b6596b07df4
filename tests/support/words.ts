// The English interface strings, public and desk together, as tests look them up (en.desk.upload…).
import desk from "../../locales/en/desk.json";
import publicWords from "../../locales/en/public.json";

export const en = { ...publicWords, ...desk };
