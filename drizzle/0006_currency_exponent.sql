-- The ISO 4217 exponent stored beside every amount that leaves the core (see lib/core/pricing/MONEY.md).
-- Existing rows are backfilled with the digits they were WRITTEN with: until this migration the digits
-- came from the runtime's locale data (Node 20 Intl), not from ISO 4217. A quote version keeps them in
-- its stored result (result->>'minorDigits'); otherwise they follow from the currency by the CASE below,
-- which lists every code that locale data did not give 2 digits. Where that differs from ISO 4217
-- (HUF, IDR, COP, PKR, IQD, ALL, AFN, IRR, KPW, LAK, LBP, MGA, MMK, SOS, SYP, YER) the stored digits
-- now disagree with the table and the app refuses to charge, refund or print those amounts with a
-- message, instead of misreading them by a factor of 100 or 1000.
ALTER TABLE "quote_versions" ADD COLUMN "minor_digits" smallint;--> statement-breakpoint
ALTER TABLE "invoices" ADD COLUMN "minor_digits" smallint;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "minor_digits" smallint;--> statement-breakpoint
ALTER TABLE "refunds" ADD COLUMN "minor_digits" smallint;--> statement-breakpoint
CREATE FUNCTION "pg_temp"."darnwell_written_digits"(code text) RETURNS smallint LANGUAGE sql IMMUTABLE AS $$
  SELECT (CASE upper(code)
    WHEN 'AFN' THEN 0 WHEN 'ALL' THEN 0 WHEN 'BIF' THEN 0 WHEN 'CLP' THEN 0 WHEN 'COP' THEN 0 WHEN 'DJF' THEN 0
    WHEN 'GNF' THEN 0 WHEN 'HUF' THEN 0 WHEN 'IDR' THEN 0 WHEN 'IQD' THEN 0 WHEN 'IRR' THEN 0 WHEN 'ISK' THEN 0
    WHEN 'JPY' THEN 0 WHEN 'KMF' THEN 0 WHEN 'KPW' THEN 0 WHEN 'KRW' THEN 0 WHEN 'LAK' THEN 0 WHEN 'LBP' THEN 0
    WHEN 'MGA' THEN 0 WHEN 'MMK' THEN 0 WHEN 'PKR' THEN 0 WHEN 'PYG' THEN 0 WHEN 'RWF' THEN 0 WHEN 'SOS' THEN 0
    WHEN 'SYP' THEN 0 WHEN 'UGX' THEN 0 WHEN 'UYI' THEN 0 WHEN 'VND' THEN 0 WHEN 'VUV' THEN 0 WHEN 'XAF' THEN 0
    WHEN 'XOF' THEN 0 WHEN 'XPF' THEN 0 WHEN 'YER' THEN 0
    WHEN 'BHD' THEN 3 WHEN 'JOD' THEN 3 WHEN 'KWD' THEN 3 WHEN 'LYD' THEN 3 WHEN 'OMR' THEN 3 WHEN 'TND' THEN 3
    WHEN 'CLF' THEN 4 WHEN 'UYW' THEN 4
    ELSE 2 END)::smallint
$$;--> statement-breakpoint
UPDATE "quote_versions" SET "minor_digits" = CASE
  WHEN jsonb_typeof("result"->'minorDigits') = 'number' AND ("result"->>'minorDigits') IN ('0', '2', '3', '4') THEN ("result"->>'minorDigits')::smallint
  ELSE "pg_temp"."darnwell_written_digits"("currency") END;--> statement-breakpoint
UPDATE "payments" p SET "minor_digits" = COALESCE(
  (SELECT v."minor_digits" FROM "quote_versions" v WHERE v."id" = p."quote_version_id" AND upper(v."currency") = upper(p."currency")),
  "pg_temp"."darnwell_written_digits"(p."currency"));--> statement-breakpoint
UPDATE "invoices" i SET "minor_digits" = COALESCE(
  (SELECT v."minor_digits" FROM "quote_versions" v WHERE v."id" = i."quote_version_id" AND upper(v."currency") = upper(i."currency")),
  "pg_temp"."darnwell_written_digits"(i."currency"));--> statement-breakpoint
UPDATE "refunds" r SET "minor_digits" = p."minor_digits" FROM "payments" p WHERE p."id" = r."payment_id";--> statement-breakpoint
DROP FUNCTION "pg_temp"."darnwell_written_digits"(text);--> statement-breakpoint
ALTER TABLE "quote_versions" ALTER COLUMN "minor_digits" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "invoices" ALTER COLUMN "minor_digits" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "payments" ALTER COLUMN "minor_digits" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "refunds" ALTER COLUMN "minor_digits" SET NOT NULL;
