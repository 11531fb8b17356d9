import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Every work order of a request, not only its active one: reports and request pages join
 * work orders to their requests, and without this index each join scans the table.
 */
export class WorkOrderRequestIndex1796200000000 implements MigrationInterface {
  name = 'WorkOrderRequestIndex1796200000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE INDEX work_order_request_idx ON work_order (service_request_id, created_at)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX work_order_request_idx`);
  }
}
