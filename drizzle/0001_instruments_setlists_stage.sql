CREATE TABLE "instruments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid NOT NULL,
	"name" text NOT NULL,
	"receives" text NOT NULL,
	"device_id" integer NOT NULL,
	"program" integer NOT NULL,
	"bank" integer NOT NULL,
	"bend_range" integer NOT NULL,
	"first_member_channel" integer NOT NULL,
	"last_member_channel" integer NOT NULL,
	"port" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "setlist_entries" (
	"setlist_id" uuid NOT NULL,
	"place" integer NOT NULL,
	"preset_id" uuid NOT NULL,
	"revision" integer,
	"trigger" integer,
	CONSTRAINT "setlist_entries_setlist_id_place_pk" PRIMARY KEY("setlist_id","place"),
	CONSTRAINT "setlist_entries_trigger_unique" UNIQUE("setlist_id","trigger")
);
--> statement-breakpoint
CREATE TABLE "setlists" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"band_id" uuid NOT NULL,
	"name" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "setlists_position_not_negative" CHECK ("setlists"."position" >= 0)
);
--> statement-breakpoint
CREATE TABLE "stage_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"setlist_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setlist_entries" ADD CONSTRAINT "setlist_entries_setlist_id_setlists_id_fk" FOREIGN KEY ("setlist_id") REFERENCES "public"."setlists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setlist_entries" ADD CONSTRAINT "setlist_entries_preset_id_presets_id_fk" FOREIGN KEY ("preset_id") REFERENCES "public"."presets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setlists" ADD CONSTRAINT "setlists_band_id_bands_id_fk" FOREIGN KEY ("band_id") REFERENCES "public"."bands"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setlists" ADD CONSTRAINT "setlists_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stage_events" ADD CONSTRAINT "stage_events_setlist_id_setlists_id_fk" FOREIGN KEY ("setlist_id") REFERENCES "public"."setlists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "instruments_owner_idx" ON "instruments" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "setlist_entries_preset_idx" ON "setlist_entries" USING btree ("preset_id");--> statement-breakpoint
CREATE INDEX "setlists_band_idx" ON "setlists" USING btree ("band_id");--> statement-breakpoint
CREATE INDEX "stage_events_setlist_idx" ON "stage_events" USING btree ("setlist_id","id");