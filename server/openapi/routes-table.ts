/**
 * The README's routes table (method, path, who, what) from the route registry. Print it with
 *   npx tsx server/openapi/routes-table.ts
 * and paste it over the table in README.md's "API" section (tests/api/openapi.test.ts checks that
 * every route is there).
 */
import { pathToFileURL } from 'node:url';
import { describeRoute, type RouteSpec } from './route-spec';
import { ROUTES } from './routes';

export function routeTableRow(spec: RouteSpec): string {
  const { method, expressPath } = describeRoute(spec.route);
  return `| ${method.toUpperCase()} | \`${expressPath}\` | ${spec.who} | ${spec.what} |`;
}

export function routesTableMarkdown(routes: RouteSpec[] = ROUTES): string {
  return ['| method | path | who | what |', '| --- | --- | --- | --- |', ...routes.map(routeTableRow)].join('\n');
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  console.log(routesTableMarkdown());
}
