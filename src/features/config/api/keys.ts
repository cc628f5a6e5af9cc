export const configKeys = {
  all: ['config'] as const,
};
