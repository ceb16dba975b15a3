/** /api/benches/:benchId/members[/:userId]. Mounted behind requireUser and loadBenchAccess (app.ts). */
import { Router } from 'express';
import {
  AddMemberRequest,
  UpdateMemberRequest,
  type MemberListResponse,
  type MemberResponse,
} from '../../contracts/benches';
import { routeParam } from '../../lib/route-param';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import type { MembersService } from './members.service';

export function membersRouter(members: MembersService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', allow('members.read'), async (_req, res) => {
    res.json({ members: await members.list(benchAccessOf(res)) } satisfies MemberListResponse);
  });

  router.post('/', allow('members.manage'), async (req, res) => {
    const input = AddMemberRequest.parse(req.body);
    const member = await members.add(benchAccessOf(res), input);
    res.status(201).json({ member } satisfies MemberResponse);
  });

  router.patch('/:userId', allow('members.manage'), async (req, res) => {
    const input = UpdateMemberRequest.parse(req.body);
    const member = await members.changeRole(benchAccessOf(res), routeParam(req, 'userId'), input);
    res.json({ member } satisfies MemberResponse);
  });

  // Owners remove anyone; every member may remove themselves (the service decides).
  router.delete('/:userId', async (req, res) => {
    await members.remove(benchAccessOf(res), routeParam(req, 'userId'));
    res.status(204).end();
  });

  return router;
}
