/** Query keys of the marks feature (marks and the comment thread of a capture), general → specific. */
export const marksKeys = {
  all: ['marks'] as const,
  captures: () => [...marksKeys.all, 'capture'] as const,
  capture: (captureId: string) => [...marksKeys.captures(), captureId] as const,
  marks: (captureId: string) => [...marksKeys.capture(captureId), 'marks'] as const,
  comments: (captureId: string) => [...marksKeys.capture(captureId), 'comments'] as const,
};
