CREATE TABLE "buyers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"name" text NOT NULL,
	"email" text,
	"phone" text,
	"address" text,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invoice_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"invoice_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"animal_id" uuid,
	"description" text NOT NULL,
	"quantity" integer DEFAULT 1 NOT NULL,
	"unit_minor" bigint NOT NULL,
	"net_minor" bigint NOT NULL,
	"tax_minor" bigint NOT NULL,
	CONSTRAINT "invoice_lines_position" UNIQUE("invoice_id","position"),
	CONSTRAINT "invoice_lines_quantity" CHECK ("invoice_lines"."quantity" > 0)
);
--> statement-breakpoint
CREATE TABLE "invoices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"sale_id" uuid NOT NULL,
	"number" text NOT NULL,
	"currency" text NOT NULL,
	"tax_rate_bp" integer NOT NULL,
	"tax_rounding" text NOT NULL,
	"shipping_minor" bigint DEFAULT 0 NOT NULL,
	"subtotal_minor" bigint NOT NULL,
	"tax_minor" bigint NOT NULL,
	"total_minor" bigint NOT NULL,
	"paid_minor" bigint DEFAULT 0 NOT NULL,
	"refunded_minor" bigint DEFAULT 0 NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"issued_on" date NOT NULL,
	"due_on" date,
	"checkout_session_id" text,
	"checkout_url" text,
	"emailed_at" timestamp with time zone,
	"cancelled_at" timestamp with time zone,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "invoices_collection_number" UNIQUE("collection_id","number"),
	CONSTRAINT "invoices_status" CHECK ("invoices"."status" in ('open', 'part_paid', 'paid', 'refunded', 'cancelled')),
	CONSTRAINT "invoices_rounding" CHECK ("invoices"."tax_rounding" in ('per_invoice', 'per_line'))
);
--> statement-breakpoint
CREATE TABLE "payment_events" (
	"event_id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"invoice_id" uuid,
	"outcome" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "payments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"invoice_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"amount_minor" bigint NOT NULL,
	"currency" text NOT NULL,
	"provider_ref" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "payments_provider_ref" UNIQUE("kind","provider_ref"),
	CONSTRAINT "payments_kind" CHECK ("payments"."kind" in ('payment', 'refund')),
	CONSTRAINT "payments_amount" CHECK ("payments"."amount_minor" > 0)
);
--> statement-breakpoint
CREATE TABLE "sale_animals" (
	"sale_id" uuid NOT NULL,
	"animal_id" uuid NOT NULL,
	"price_minor" bigint NOT NULL,
	"currency" text NOT NULL,
	"released_at" timestamp with time zone,
	CONSTRAINT "sale_animals_sale_id_animal_id_pk" PRIMARY KEY("sale_id","animal_id")
);
--> statement-breakpoint
CREATE TABLE "sale_listings" (
	"animal_id" uuid PRIMARY KEY NOT NULL,
	"collection_id" uuid NOT NULL,
	"price_minor" bigint NOT NULL,
	"currency" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"listed_publicly" boolean DEFAULT true NOT NULL,
	"listed_by" uuid,
	"listed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sale_listings_price" CHECK ("sale_listings"."price_minor" >= 0)
);
--> statement-breakpoint
CREATE TABLE "sales" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"buyer_id" uuid NOT NULL,
	"status" text DEFAULT 'reserved' NOT NULL,
	"reserved_until" date NOT NULL,
	"note" text,
	"ship_on" date,
	"ship_route" text,
	"forecast_low_c" double precision,
	"forecast_high_c" double precision,
	"ship_check_confirmed_at" timestamp with time zone,
	"ship_check_confirmed_by" uuid,
	"packing" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"carrier" text,
	"tracking" text,
	"shipped_at" timestamp with time zone,
	"ended_at" timestamp with time zone,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sales_status" CHECK ("sales"."status" in ('reserved', 'shipped', 'expired', 'cancelled'))
);
--> statement-breakpoint
CREATE TABLE "sales_settings" (
	"collection_id" uuid PRIMARY KEY NOT NULL,
	"currency" text DEFAULT 'EUR' NOT NULL,
	"tax_rate_bp" integer DEFAULT 0 NOT NULL,
	"tax_rounding" text DEFAULT 'per_invoice' NOT NULL,
	"seller_details" text DEFAULT '' NOT NULL,
	"hold_days" integer DEFAULT 7 NOT NULL,
	"safe_min_c" double precision DEFAULT 5 NOT NULL,
	"safe_max_c" double precision DEFAULT 30 NOT NULL,
	"availability_on" boolean DEFAULT false NOT NULL,
	"availability_token" text,
	"availability_columns" text[] DEFAULT '{species,stage,size,price,count}'::text[] NOT NULL,
	"availability_note" text DEFAULT '' NOT NULL,
	"next_invoice_number" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sales_settings_availability_token" UNIQUE("availability_token"),
	CONSTRAINT "sales_settings_tax" CHECK ("sales_settings"."tax_rate_bp" between 0 and 10000),
	CONSTRAINT "sales_settings_rounding" CHECK ("sales_settings"."tax_rounding" in ('per_invoice', 'per_line')),
	CONSTRAINT "sales_settings_range" CHECK ("sales_settings"."safe_min_c" < "sales_settings"."safe_max_c"),
	CONSTRAINT "sales_settings_hold" CHECK ("sales_settings"."hold_days" between 1 and 365)
);
--> statement-breakpoint
ALTER TABLE "buyers" ADD CONSTRAINT "buyers_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoice_lines" ADD CONSTRAINT "invoice_lines_invoice_id_invoices_id_fk" FOREIGN KEY ("invoice_id") REFERENCES "public"."invoices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoice_lines" ADD CONSTRAINT "invoice_lines_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoices" ADD CONSTRAINT "invoices_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoices" ADD CONSTRAINT "invoices_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoices" ADD CONSTRAINT "invoices_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payment_events" ADD CONSTRAINT "payment_events_invoice_id_invoices_id_fk" FOREIGN KEY ("invoice_id") REFERENCES "public"."invoices"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payments" ADD CONSTRAINT "payments_invoice_id_invoices_id_fk" FOREIGN KEY ("invoice_id") REFERENCES "public"."invoices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sale_animals" ADD CONSTRAINT "sale_animals_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sale_animals" ADD CONSTRAINT "sale_animals_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sale_listings" ADD CONSTRAINT "sale_listings_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sale_listings" ADD CONSTRAINT "sale_listings_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sale_listings" ADD CONSTRAINT "sale_listings_listed_by_users_id_fk" FOREIGN KEY ("listed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_buyer_id_buyers_id_fk" FOREIGN KEY ("buyer_id") REFERENCES "public"."buyers"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_ship_check_confirmed_by_users_id_fk" FOREIGN KEY ("ship_check_confirmed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales_settings" ADD CONSTRAINT "sales_settings_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "buyers_collection_idx" ON "buyers" USING btree ("collection_id");--> statement-breakpoint
CREATE UNIQUE INDEX "invoices_one_live_per_sale" ON "invoices" USING btree ("sale_id") WHERE "invoices"."cancelled_at" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "invoices_checkout_session" ON "invoices" USING btree ("checkout_session_id");--> statement-breakpoint
CREATE INDEX "payments_invoice_idx" ON "payments" USING btree ("invoice_id");--> statement-breakpoint
CREATE UNIQUE INDEX "sale_animals_one_live_sale" ON "sale_animals" USING btree ("animal_id") WHERE "sale_animals"."released_at" is null;--> statement-breakpoint
CREATE INDEX "sale_listings_collection_idx" ON "sale_listings" USING btree ("collection_id");--> statement-breakpoint
CREATE INDEX "sales_collection_idx" ON "sales" USING btree ("collection_id","status");--> statement-breakpoint
CREATE INDEX "sales_buyer_idx" ON "sales" USING btree ("buyer_id");