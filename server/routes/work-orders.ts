import {
  ArriveRequest,
  CompleteRequest,
  CostDecisionRequest,
  CostDisputeRequest,
  DeclineRequest,
  RecordLabourRequest,
  RecordPartRequest,
  ScheduleRequest,
  UpdateWorkOrderRequest,
  UploadAttachmentFields,
  WorkOrderIdParams,
  WorkOrderQuery,
} from '../../shared/api/work-orders';
import { RouteGroup, type RouteRule } from '../auth/route-table';
import type { workOrdersController } from '../controllers/work-orders';
import { validate } from '../middleware/validate';
import { receiveFiles } from '../storage/uploads';

const params = validate({ params: WorkOrderIdParams });

/** Work orders: managers oversee their organization's, contractors work their company's. */
export function workOrdersRoutes(controller: ReturnType<typeof workOrdersController>): RouteGroup {
  const either = (summary: string): RouteRule => ({ access: ['manager', 'contractor'], scope: 'assignment', summary });
  const contractor = (summary: string): RouteRule => ({ access: ['contractor'], scope: 'assignment', summary });
  const manager = (summary: string): RouteRule => ({ access: ['manager'], scope: 'organization', summary });
  return new RouteGroup('/api/work-orders')
    .get('/', either('work orders in reach, open first by due time'), validate({ query: WorkOrderQuery }), controller.list)
    .get('/:workOrderId', either('one work order with diagnosis, cautions, history, parts, labour and photos'), params, controller.get)
    .post('/:workOrderId/accept', contractor('accept a dispatched job'), params, controller.accept)
    .post('/:workOrderId/decline', contractor('decline a dispatched job, with a reason'), validate({ params: WorkOrderIdParams, body: DeclineRequest }), controller.decline)
    .post('/:workOrderId/schedule', contractor('schedule (or move) the visit'), validate({ params: WorkOrderIdParams, body: ScheduleRequest }), controller.schedule)
    .post('/:workOrderId/arrive', contractor('technician on site: starts a visit'), validate({ params: WorkOrderIdParams, body: ArriveRequest }), controller.arrive)
    .post('/:workOrderId/complete', contractor('complete with the cause found and findings'), validate({ params: WorkOrderIdParams, body: CompleteRequest }), controller.complete)
    .patch('/:workOrderId', either('update findings or notes'), validate({ params: WorkOrderIdParams, body: UpdateWorkOrderRequest }), controller.update)
    .post('/:workOrderId/parts', contractor('record a part replaced'), validate({ params: WorkOrderIdParams, body: RecordPartRequest }), controller.recordPart)
    .post('/:workOrderId/labour', contractor('record labour time and rate'), validate({ params: WorkOrderIdParams, body: RecordLabourRequest }), controller.recordLabour)
    .post('/:workOrderId/attachments', either('upload a photo or PDF (multipart field "file")'), params, receiveFiles('file', 1), validate({ body: UploadAttachmentFields }), controller.upload)
    .post('/:workOrderId/cost/approve', manager('approve the completed job\'s cost'), validate({ params: WorkOrderIdParams, body: CostDecisionRequest }), controller.approveCost)
    .post('/:workOrderId/cost/dispute', manager('dispute the cost, with a note'), validate({ params: WorkOrderIdParams, body: CostDisputeRequest }), controller.disputeCost)
    .post('/:workOrderId/verify', manager('confirm the repair by hand (no telemetry)'), validate({ params: WorkOrderIdParams, body: CostDecisionRequest }), controller.verify);
}
