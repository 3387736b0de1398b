import type { Metadata } from "next";
import Link from "next/link";
import { ApproveDiscountButton } from "@/components/proposals/quote-manager-form";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import {
  ValueByMonthChart,
  ValueByStageChart,
  type ValueRow,
} from "@/components/pipeline/pipeline-charts";
import { ValueTable } from "@/components/pipeline/value-table";
import { buttonClass } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Pager } from "@/components/ui/pager";
import { NumberTd, SortHeader, Table, Td } from "@/components/ui/table";
import {
  pipeline,
  pipelineFilterOptions,
  pipelineQuotesPage,
  pipelineWinRate,
} from "@/db/queries/pipeline";
import { getSalesSettings } from "@/db/queries/sales-settings";
import { requirePageUser } from "@/server/auth";
import { type SearchParams } from "@/lib/pages";
import { flatParams, listHref } from "@/lib/lists/list-params";
import { sum } from "@/lib/pipeline/figures";
import { OPEN_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import { formatMoney, formatPayback, formatPct } from "@/lib/results/format";
import {
  pipelineFiltersSchema,
  pipelineGroupSortSchema,
  pipelineListParamsSchema,
} from "@/lib/validations/pipeline";
import { sortGroups } from "@/lib/pipeline/sort-quotes";
import { QuoteStageOptions } from "@/components/proposals/quote-stage-options";
import { needsDiscountApproval } from "@/lib/pipeline/discount";
import { CUSTOMER_INVESTMENT_NOTE, FINANCE_TERMS, VENDOR_REVENUE_BREAKDOWN } from "@/lib/glossary";

export const metadata: Metadata = { title: "Pipeline" };

const monthLabel = (month: string) =>
  new Date(`${month}-01T00:00:00Z`).toLocaleDateString("en-GB", {
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });

// A table of sums behind one of the charts: by stage or by expected close month.
type GroupTable = { group: "stage" | "month"; rows: ValueRow[]; first: string; caption: string };

// The CSV export with the same filters as the page (its sort and page do not matter there).
function csvHref(current: Record<string, string | undefined>) {
  const keep = ["owner", "stage", "account", "closeMonth"];
  const query = new URLSearchParams(
    Object.entries(current).flatMap(([key, value]) =>
      keep.includes(key) && value ? [[key, value]] : [],
    ),
  ).toString();
  return `/api/v1/pipeline.csv${query ? `?${query}` : ""}`;
}

function monthsBefore(month: string, n: number) {
  const [y, m] = month.split("-").map(Number);
  const d = new Date(Date.UTC(y, m - 1 - n, 1));
  return d.toISOString().slice(0, 7);
}

export default async function PipelinePage({ searchParams }: { searchParams: SearchParams }) {
  const user = await requirePageUser("manager", "engineer");
  const current = flatParams(await searchParams);
  const filters = pipelineFiltersSchema.parse(current);
  const listParams = pipelineListParamsSchema.parse(current);
  const groupSort = pipelineGroupSortSchema.parse(current);
  const thisMonth = new Date().toISOString().slice(0, 7);
  const period = { to: filters.to ?? thisMonth, from: filters.from ?? monthsBefore(thisMonth, 11) };
  if (period.from > period.to) [period.from, period.to] = [period.to, period.from];

  // The charts and totals cover every quote the filters let through; the table shows one page.
  const data = pipeline(user, filters);
  const quotePage = pipelineQuotesPage(user, filters, listParams, undefined, data.quotes);
  const sortHref = (column: string, dir: "asc" | "desc") =>
    listHref("/pipeline", current, { sort: column, dir });
  const sortable = (label: string, column: string, right = false) => (
    <SortHeader
      key={column}
      label={label}
      column={column}
      sort={listParams.sort}
      dir={listParams.dir}
      href={sortHref}
      className={right ? "text-right" : undefined}
    />
  );
  const options = pipelineFilterOptions(user);
  const rate = pipelineWinRate(user, period, { owner: filters.owner, account: filters.account });
  const settings = getSalesSettings();
  const isManager = user.role === "manager";
  const awaitingApproval = isManager
    ? data.quotes.filter(
        (q) =>
          needsDiscountApproval(q, settings.discountThresholdPct) && OPEN_STAGES.includes(q.stage),
      )
    : [];
  const filtered = Boolean(filters.owner || filters.stage || filters.account || filters.closeMonth);

  return (
    <div className="space-y-6">
      <PageHeader
        title="Pipeline"
        lead={
          isManager
            ? "Every frozen proposal as a quote: where it stands with the customer, what it is worth, and when it should close."
            : "Your quotes: where each stands with the customer, what it is worth, and when it should close."
        }
      />

      <Panel title="Filters">
        <form
          method="get"
          action="/pipeline"
          role="search"
          className="flex flex-wrap items-end gap-3"
        >
          {isManager ? (
            <FilterField id="f-owner" label="Owner">
              <Select id="f-owner" name="owner" defaultValue={filters.owner ?? ""} className="w-52">
                <option value="">Every owner</option>
                {options.owners.map((o) => (
                  <option key={o.id} value={o.id}>
                    {o.name}
                  </option>
                ))}
              </Select>
            </FilterField>
          ) : null}
          <FilterField id="f-stage" label="Stage">
            <Select id="f-stage" name="stage" defaultValue={filters.stage ?? ""} className="w-56">
              <option value="">Every stage</option>
              <QuoteStageOptions />
            </Select>
          </FilterField>
          <FilterField id="f-account" label="Account">
            <Select
              id="f-account"
              name="account"
              defaultValue={filters.account ?? ""}
              className="w-64"
            >
              <option value="">Every account</option>
              {options.accounts.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.name}
                </option>
              ))}
            </Select>
          </FilterField>
          <FilterField id="f-close" label="Close month">
            <Input
              id="f-close"
              name="closeMonth"
              type="month"
              defaultValue={filters.closeMonth ?? ""}
              className="w-44"
            />
          </FilterField>
          <FilterField id="f-from" label="Win rate from">
            <Input
              id="f-from"
              name="from"
              type="month"
              defaultValue={period.from}
              className="w-44"
            />
          </FilterField>
          <FilterField id="f-to" label="Win rate to">
            <Input id="f-to" name="to" type="month" defaultValue={period.to} className="w-44" />
          </FilterField>
          {current.sort ? <input type="hidden" name="sort" value={listParams.sort} /> : null}
          {current.dir ? <input type="hidden" name="dir" value={listParams.dir} /> : null}
          <button type="submit" className={buttonClass("secondary")}>
            Apply filters
          </button>
          {filtered ? (
            <Link href="/pipeline" className={buttonClass("ghost")}>
              Clear
            </Link>
          ) : null}
        </form>
      </Panel>

      {data.totals.length === 0 ? (
        <EmptyState title={filtered ? "No quote matches these filters" : "No quotes yet"}>
          A quote appears here when a case is frozen as a proposal.
        </EmptyState>
      ) : (
        data.totals.map((t) => {
          const inCurrency = data.quotes.filter((q) => q.currency === t.currency);
          const open = inCurrency.filter((q) => OPEN_STAGES.includes(q.stage));
          const stageRows = data.stages
            .filter((s) => s.currency === t.currency)
            .map((s) => ({ key: s.stage, label: STAGE_LABELS[s.stage], ...s }));
          const monthRows = data.byMonth
            .filter((m) => m.currency === t.currency && m.count > 0)
            .map((m) => ({ key: m.month, label: monthLabel(m.month), ...m }));
          // The two tables behind the charts differ only in their rows, first column, caption
          // and the URL keys their sort is kept under (stageSort and stageDir, or month…).
          const groupTables: GroupTable[] = [
            { group: "stage", rows: stageRows, first: "Stage", caption: "Revenue by stage" },
            {
              group: "month",
              rows: monthRows,
              first: "Close month",
              caption: "Revenue by expected close month",
            },
          ];
          const [stageTable, monthTable] = groupTables.map(({ group, rows, first, caption }) => {
            const sortKey = `${group}Sort` as const;
            const dirKey = `${group}Dir` as const;
            return (
              <ValueTable
                key={group}
                rows={sortGroups(rows, groupSort[sortKey], groupSort[dirKey])}
                currency={t.currency}
                first={first}
                caption={caption}
                sort={groupSort[sortKey]}
                dir={groupSort[dirKey]}
                href={(column, dir) =>
                  listHref("/pipeline", current, {
                    [sortKey]: column,
                    [dirKey]: dir,
                    page: current.page,
                  })
                }
              />
            );
          });
          return (
            <section key={t.currency} aria-label={`Totals in ${t.currency}`} className="space-y-6">
              <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
                <Card
                  label="Quotes shown"
                  value={String(t.count)}
                  note={`${open.length} still open`}
                />
                <Card
                  label={FINANCE_TERMS.vendorRevenue}
                  value={formatMoney(t.revenue, t.currency)}
                  note={`Open: ${formatMoney(sum(open.map((q) => q.vendorRevenue)), t.currency)}. The customers invest ${formatMoney(t.value, t.currency)} in all`}
                  testId="revenue-total"
                />
                <Card
                  label={FINANCE_TERMS.weightedRevenue}
                  value={formatMoney(t.weighted, t.currency)}
                  note={`${open.length} open quotes only, each one's revenue × the chance of its stage`}
                  testId="weighted-total"
                />
                <WinRateCard rate={rate} period={period} />
              </div>
              <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-2">
                <ValueByStageChart
                  rows={stageRows}
                  currency={t.currency}
                  table={stageTable}
                  asTable={Boolean(current.stageSort)}
                />
                <ValueByMonthChart
                  rows={monthRows}
                  currency={t.currency}
                  table={monthTable}
                  asTable={Boolean(current.monthSort)}
                />
              </div>
            </section>
          );
        })
      )}

      {awaitingApproval.length ? (
        <Panel title="Discounts waiting for your approval">
          <ul className="space-y-3">
            {awaitingApproval.map((q) => (
              <li key={q.id} className="flex flex-wrap items-center justify-between gap-3">
                <span>
                  <Link
                    href={`/proposals/${q.id}`}
                    className="font-bold text-flux-700 hover:underline"
                  >
                    {q.caseName}, v{q.version}
                  </Link>{" "}
                  · {q.accountName} · {q.ownerName} · kit discount up to {q.maxDiscountPct} % (above{" "}
                  {settings.discountThresholdPct} %)
                </span>
                <ApproveDiscountButton proposalId={q.id} />
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}

      {data.quotes.length ? (
        <Panel title={`Quotes (${data.quotes.length})`}>
          <Table caption="Quotes">
            <thead>
              <tr>
                {sortable("Proposal", "proposal")}
                {sortable("Account", "account")}
                {sortable("Owner", "owner")}
                {sortable("Stage", "stage")}
                {sortable(FINANCE_TERMS.vendorRevenue, "revenue", true)}
                {sortable(FINANCE_TERMS.customerInvestment, "investment", true)}
                {sortable("Chance", "chance", true)}
                {sortable(FINANCE_TERMS.weightedRevenue, "weighted", true)}
                {sortable("Expected close", "close")}
                {sortable("Payback", "payback")}
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {quotePage.rows.map((q) => (
                <tr key={q.id} data-testid={`quote-${q.id}`}>
                  <Td className="font-bold">
                    <Link href={`/proposals/${q.id}`} className="text-flux-700 hover:underline">
                      {q.caseName}, v{q.version}
                    </Link>
                  </Td>
                  <Td>{q.accountName}</Td>
                  <Td>{q.ownerName}</Td>
                  <Td>
                    <QuoteStageBadge stage={q.stage} />
                  </Td>
                  <NumberTd>{formatMoney(q.vendorRevenue, q.currency)}</NumberTd>
                  <NumberTd>{formatMoney(q.value, q.currency)}</NumberTd>
                  <Td className="text-right tabular-nums">{q.probabilityPct} %</Td>
                  <NumberTd>{formatMoney(q.weighted, q.currency)}</NumberTd>
                  <Td className="whitespace-nowrap tabular-nums">{q.expectedCloseOn}</Td>
                  <NumberTd>{formatPayback(q.paybackYears)}</NumberTd>
                </tr>
              ))}
            </tbody>
            <tfoot>
              {data.totals.map((t) => (
                <tr key={t.currency} className="bg-steel-50 font-bold">
                  <Td colSpan={4}>
                    Total of the filtered quotes ({t.count}); the weighted total counts open quotes
                    only
                  </Td>
                  <NumberTd>{formatMoney(t.revenue, t.currency)}</NumberTd>
                  <NumberTd>{formatMoney(t.value, t.currency)}</NumberTd>
                  <Td />
                  <NumberTd>{formatMoney(t.weighted, t.currency)}</NumberTd>
                  <Td colSpan={2} />
                </tr>
              ))}
            </tfoot>
          </Table>
          <p className="mt-3">
            <a
              href={csvHref(current)}
              className="text-flux-700 underline hover:text-flux-800"
              download
            >
              Download these quotes as CSV
            </a>
          </p>
          <Pager
            page={quotePage.page}
            pageCount={quotePage.pageCount}
            total={quotePage.total}
            noun={["quote", "quotes"]}
            href={(page) => listHref("/pipeline", current, { page })}
          />
          <dl
            className="mt-4 space-y-2 text-small text-steel-800"
            aria-label="What the amounts count"
          >
            <div>
              <dt className="inline font-bold">{FINANCE_TERMS.vendorRevenue}: </dt>
              <dd className="inline">
                what the vendor invoices for the quote: {VENDOR_REVENUE_BREAKDOWN}. The totals and
                the weighted revenue add this up.
              </dd>
            </div>
            <div>
              <dt className="inline font-bold">{FINANCE_TERMS.customerInvestment}: </dt>
              <dd className="inline">
                the up-front cost the customer&apos;s business case is built on:{" "}
                {CUSTOMER_INVESTMENT_NOTE}.
              </dd>
            </div>
            <div>
              <dt className="inline font-bold">{FINANCE_TERMS.weightedRevenue}: </dt>
              <dd className="inline">
                the revenue of each open quote (ready, sent or changes asked) times the chance of
                closing from its stage; a won, declined or replaced quote adds nothing.
              </dd>
            </div>
          </dl>
          <p className="mt-3 text-caption text-steel-600">
            Chance of closing per stage as the administrator set it
            {settings.isDefault
              ? " (still the starting estimates: replace them with your own win history)"
              : ""}
            . Amounts in different currencies are never added together.
          </p>
        </Panel>
      ) : null}
    </div>
  );
}

function FilterField({
  id,
  label,
  children,
}: {
  id: string;
  label: string;
  children: React.ReactNode;
}) {
  return (
    <div>
      <label htmlFor={id} className="block text-small font-bold text-steel-800">
        {label}
      </label>
      {children}
    </div>
  );
}

function Card({
  label,
  value,
  note,
  testId,
}: {
  label: string;
  value: string;
  note: string;
  testId?: string;
}) {
  return (
    <div className="rounded-panel border border-steel-200 bg-white p-5 shadow-panel">
      <p className="text-caption font-bold uppercase tracking-wide text-steel-600">{label}</p>
      <p className="mt-1 text-headline font-black tabular-nums text-flux-800" data-testid={testId}>
        {value}
      </p>
      <p className="mt-1 text-small text-steel-700">{note}</p>
    </div>
  );
}

function WinRateCard({
  rate,
  period,
}: {
  rate: { won: number; lost: number; ratePct: number | null };
  period: { from: string; to: string };
}) {
  return (
    <div className="rounded-panel border border-steel-200 bg-white p-5 shadow-panel">
      <p className="text-caption font-bold uppercase tracking-wide text-steel-600">Win rate</p>
      <p
        className="mt-1 text-headline font-black tabular-nums text-flux-800"
        data-testid="win-rate"
      >
        {rate.ratePct === null ? "—" : formatPct(rate.ratePct, 0)}
      </p>
      <p className="mt-1 text-small text-steel-700">
        {rate.won} won of {rate.won + rate.lost} decided (accepted or declined) between{" "}
        {monthLabel(period.from)} and {monthLabel(period.to)}; open quotes do not count. The period
        is set in the filters
      </p>
    </div>
  );
}
