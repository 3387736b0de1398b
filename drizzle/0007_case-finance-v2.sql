-- Engine v2 (ENGINE.md §2, §8) adds inflation, tax rate and depreciation years to a case's
-- finance assumptions. Cases stored before get the engine's defaults written in, which are the
-- values that reproduce v1 (no inflation, pre-tax flows; depreciation unused without tax), so
-- their results change only by the corrected physics. json_insert leaves a value already present.
UPDATE `cases` SET `assumptions` = json_insert(
	`assumptions`,
	'$.finance.inflationPct', 0,
	'$.finance.taxRatePct', 0,
	'$.finance.depreciationYears', 5
);
