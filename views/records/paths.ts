/** Where each records page and file lives, written once so links and routes agree. */
const id = (checkId: string) => encodeURIComponent(checkId);

export const checkPath = (checkId: string) => `/records/${id(checkId)}`;
export const signPath = (checkId: string) => `/records/${id(checkId)}/sign`;
export const comparePath = (checkId: string, from?: number, to?: number) =>
  from === undefined || to === undefined ? `/records/${id(checkId)}/compare` : `/records/${id(checkId)}/compare?from=${from}&to=${to}`;
export const openPath = (checkId: string, revision: number) => `/records/${id(checkId)}/revisions/${revision}/open`;
export const inputPath = (checkId: string, revision: number) => `/records/${id(checkId)}/revisions/${revision}/input`;
export const revisionSavePath = (checkId: string) => `/records/${id(checkId)}/revisions`;
export const sheetPath = (checkId: string, revision: number) => `/api/v1/checks/${id(checkId)}/revisions/${revision}/sheet`;
export const exportPath = (checkId: string) => `/api/v1/checks/${id(checkId)}/export`;
export const PEOPLE_PATH = "/records/people";
export const SIGNIN_PATH = "/signin";
export const SIGNOUT_PATH = "/signout";
export const SETUP_PATH = "/setup";
export const SAVE_PATH = "/records/save";
