/** A named route parameter as one string (Express 5 types allow string[] for wildcard segments). */
import type { Request } from 'express';

export function routeParam(req: Request, name: string): string {
  const value = (req.params as Record<string, string | string[] | undefined>)[name];
  return Array.isArray(value) ? value.join('/') : (value ?? '');
}
