import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Seats and payments, the data (issue 11):
 * - `seat_pool`: a shop's seats, or an individual learner's own; `purchased` (credited from paid
 *   checkout events), `refunded` (reserved when a refund is asked for, given back if it fails) and
 *   `in_use` (seats held by an invitation or assigned), kept by a trigger on `seat`. The CHECK
 *   `in_use + refunded <= purchased` is the rule that no pool hands out more seats than were paid
 *   for and not refunded: the database refuses, whatever the code does.
 * - `seat`: one row per holding of a seat (invited → assigned → released); history stays.
 * - `seat_order`: a purchase (integer minor units), its checkout session and status.
 * - `payment_event`: each provider event once (its id is the key), with what came of it.
 * - `seat_refund`: refunds of unused seats, settled by the provider's events.
 */
export class Seats1796800000000 implements MigrationInterface {
  name = 'Seats1796800000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE seat_pool (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        shop_id uuid,
        learner_id uuid,
        purchased integer NOT NULL DEFAULT 0,
        refunded integer NOT NULL DEFAULT 0,
        in_use integer NOT NULL DEFAULT 0,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT seat_pool_pkey PRIMARY KEY (id),
        CONSTRAINT seat_pool_shop_fkey FOREIGN KEY (shop_id) REFERENCES shop (id) ON DELETE RESTRICT,
        CONSTRAINT seat_pool_learner_fkey FOREIGN KEY (learner_id) REFERENCES user_account (id) ON DELETE RESTRICT,
        CONSTRAINT seat_pool_owner_check CHECK ((shop_id IS NULL) <> (learner_id IS NULL)),
        CONSTRAINT seat_pool_balance_check CHECK (purchased >= 0 AND refunded >= 0 AND in_use >= 0 AND in_use + refunded <= purchased)
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX seat_pool_shop_key ON seat_pool (shop_id)');
    await queryRunner.query('CREATE UNIQUE INDEX seat_pool_learner_key ON seat_pool (learner_id)');

    await queryRunner.query(`CREATE TYPE seat_status AS ENUM ('invited', 'assigned', 'released')`);
    await queryRunner.query(`
      CREATE TABLE seat (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        pool_id uuid NOT NULL,
        status seat_status NOT NULL,
        holder_id uuid,
        invited_email varchar(254),
        created_at timestamptz NOT NULL DEFAULT now(),
        assigned_at timestamptz,
        released_at timestamptz,
        CONSTRAINT seat_pkey PRIMARY KEY (id),
        CONSTRAINT seat_pool_fkey FOREIGN KEY (pool_id) REFERENCES seat_pool (id) ON DELETE RESTRICT,
        CONSTRAINT seat_holder_fkey FOREIGN KEY (holder_id) REFERENCES user_account (id) ON DELETE CASCADE,
        CONSTRAINT seat_holder_check CHECK (status <> 'assigned' OR holder_id IS NOT NULL),
        CONSTRAINT seat_invited_check CHECK (status <> 'invited' OR invited_email IS NOT NULL)
      )`);
    await queryRunner.query('CREATE INDEX seat_pool_idx ON seat (pool_id, status)');
    // An apprentice holds at most one seat at a time.
    await queryRunner.query(`CREATE UNIQUE INDEX seat_holder_key ON seat (holder_id) WHERE status = 'assigned'`);

    // in_use follows the seats: +1 when a seat is held (invited or assigned), -1 when it is released
    // or deleted. The pool row's update takes its lock, so concurrent holders queue on it, and the
    // balance CHECK refuses the one that would go past what was paid for.
    await queryRunner.query(`
      CREATE FUNCTION seat_pool_count() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        was_held boolean := TG_OP <> 'INSERT' AND OLD.status <> 'released';
        is_held boolean := TG_OP <> 'DELETE' AND NEW.status <> 'released';
      BEGIN
        IF TG_OP = 'UPDATE' AND OLD.pool_id <> NEW.pool_id THEN
          RAISE EXCEPTION 'a seat does not move between pools';
        END IF;
        IF was_held AND NOT is_held THEN
          UPDATE seat_pool SET in_use = in_use - 1 WHERE id = OLD.pool_id;
        ELSIF is_held AND NOT was_held THEN
          UPDATE seat_pool SET in_use = in_use + 1 WHERE id = NEW.pool_id;
        END IF;
        RETURN NULL;
      END $$`);
    await queryRunner.query('CREATE TRIGGER seat_pool_count AFTER INSERT OR DELETE OR UPDATE OF status, pool_id ON seat FOR EACH ROW EXECUTE FUNCTION seat_pool_count()');

    await queryRunner.query(`CREATE TYPE seat_order_status AS ENUM ('pending', 'paid', 'expired', 'failed')`);
    await queryRunner.query('CREATE SEQUENCE seat_order_number_seq START 1001');
    await queryRunner.query(`
      CREATE TABLE seat_order (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        number bigint NOT NULL DEFAULT nextval('seat_order_number_seq'),
        pool_id uuid NOT NULL,
        buyer_id uuid,
        quantity integer NOT NULL,
        unit_amount integer NOT NULL,
        total_amount integer NOT NULL,
        currency varchar(3) NOT NULL,
        status seat_order_status NOT NULL DEFAULT 'pending',
        checkout_session_id varchar(255),
        payment_intent_id varchar(255),
        card_last4 varchar(4),
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        paid_at timestamptz,
        CONSTRAINT seat_order_pkey PRIMARY KEY (id),
        CONSTRAINT seat_order_pool_fkey FOREIGN KEY (pool_id) REFERENCES seat_pool (id) ON DELETE RESTRICT,
        CONSTRAINT seat_order_buyer_fkey FOREIGN KEY (buyer_id) REFERENCES user_account (id) ON DELETE SET NULL,
        CONSTRAINT seat_order_amount_check CHECK (quantity BETWEEN 1 AND 500 AND unit_amount > 0 AND total_amount = unit_amount * quantity)
      )`);
    await queryRunner.query('ALTER SEQUENCE seat_order_number_seq OWNED BY seat_order.number');
    await queryRunner.query('CREATE UNIQUE INDEX seat_order_number_key ON seat_order (number)');
    await queryRunner.query('CREATE UNIQUE INDEX seat_order_session_key ON seat_order (checkout_session_id)');
    await queryRunner.query('CREATE INDEX seat_order_pool_idx ON seat_order (pool_id, created_at)');

    await queryRunner.query(`CREATE TYPE payment_event_outcome AS ENUM ('applied', 'ignored', 'failed')`);
    await queryRunner.query(`
      CREATE TABLE payment_event (
        id varchar(255) NOT NULL,
        type varchar(100) NOT NULL,
        outcome payment_event_outcome NOT NULL,
        reason text,
        order_id uuid,
        deliveries integer NOT NULL DEFAULT 1,
        received_at timestamptz NOT NULL DEFAULT now(),
        last_received_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT payment_event_pkey PRIMARY KEY (id),
        CONSTRAINT payment_event_order_fkey FOREIGN KEY (order_id) REFERENCES seat_order (id) ON DELETE SET NULL
      )`);
    await queryRunner.query('CREATE INDEX payment_event_received_idx ON payment_event (received_at)');

    await queryRunner.query(`CREATE TYPE seat_refund_status AS ENUM ('pending', 'succeeded', 'failed')`);
    await queryRunner.query(`
      CREATE TABLE seat_refund (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        order_id uuid NOT NULL,
        quantity integer NOT NULL,
        amount integer NOT NULL,
        status seat_refund_status NOT NULL DEFAULT 'pending',
        provider_refund_id varchar(255),
        requested_by uuid,
        created_at timestamptz NOT NULL DEFAULT now(),
        settled_at timestamptz,
        CONSTRAINT seat_refund_pkey PRIMARY KEY (id),
        CONSTRAINT seat_refund_order_fkey FOREIGN KEY (order_id) REFERENCES seat_order (id) ON DELETE RESTRICT,
        CONSTRAINT seat_refund_requester_fkey FOREIGN KEY (requested_by) REFERENCES user_account (id) ON DELETE SET NULL,
        CONSTRAINT seat_refund_amount_check CHECK (quantity > 0 AND amount > 0)
      )`);
    await queryRunner.query('CREATE UNIQUE INDEX seat_refund_provider_key ON seat_refund (provider_refund_id)');
    await queryRunner.query('CREATE INDEX seat_refund_order_idx ON seat_refund (order_id)');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE seat_refund');
    await queryRunner.query('DROP TYPE seat_refund_status');
    await queryRunner.query('DROP TABLE payment_event');
    await queryRunner.query('DROP TYPE payment_event_outcome');
    await queryRunner.query('DROP TABLE seat_order');
    await queryRunner.query('DROP TYPE seat_order_status');
    await queryRunner.query('DROP TRIGGER seat_pool_count ON seat');
    await queryRunner.query('DROP FUNCTION seat_pool_count()');
    await queryRunner.query('DROP TABLE seat');
    await queryRunner.query('DROP TYPE seat_status');
    await queryRunner.query('DROP TABLE seat_pool');
  }
}
