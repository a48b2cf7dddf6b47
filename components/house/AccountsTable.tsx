"use client";

import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ROLES, ROLE_LABEL, type Role } from "@/lib/auth/roles";
import { apiFetch } from "@/lib/client/api";

type Account = {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
  createdAt: string;
  addressConfirmed: boolean;
};

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString },
});
const helper = createColumnHelper<typeof features, Account>();
const EMPTY: Account[] = [];

/** The house grants and removes roles; reads and writes go through /api/admin/users. */
export function AccountsTable({ selfId }: { selfId: string }) {
  const qc = useQueryClient();
  const [filter, setFilter] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  // The boxes show a change at once; the server's answer then confirms or reverts it.
  const [pending, setPending] = useState<Record<string, Role[]>>({});
  const { data, isLoading, error } = useQuery({
    queryKey: ["admin-users"],
    queryFn: () => apiFetch<{ accounts: Account[] }>("/api/admin/users"),
  });
  const save = useMutation({
    mutationFn: (v: { id: string; roles: Role[] }) =>
      apiFetch<{ account: Account }>(`/api/admin/users/${v.id}`, { method: "PATCH", json: { roles: v.roles } }),
    onSuccess: async (r) => {
      setMessage(`Roles saved for ${r.account.displayName}.`);
      await qc.invalidateQueries({ queryKey: ["admin-users"] });
      setPending((p) => {
        const n = { ...p };
        delete n[r.account.id];
        return n;
      });
    },
    onError: (e, v) => {
      setMessage(e instanceof Error ? e.message : "Could not save");
      setPending((p) => {
        const n = { ...p };
        delete n[v.id];
        return n;
      });
    },
  });

  const columns = helper.columns([
    helper.accessor("displayName", { header: "Name", sortFn: "alphanumeric" }),
    helper.accessor("email", { header: "E-mail", sortFn: "alphanumeric" }),
    helper.accessor("createdAt", {
      header: "Joined",
      cell: (c) => (
        <>
          {c.getValue().slice(0, 10)}
          {c.row.original.addressConfirmed ? null : (
            <span className="block text-xs text-flash-600">waiting for the e-mailed link</span>
          )}
        </>
      ),
    }),
    helper.display({
      id: "roles",
      header: "Roles",
      cell: ({ row }) => (
        <div className="flex flex-wrap gap-3">
          {ROLES.map((r) => {
            const current = pending[row.original.id] ?? row.original.roles;
            const checked = current.includes(r);
            const locked = row.original.id === selfId && r === "admin";
            return (
              <label key={r} className="inline-flex items-center gap-1.5 text-sm">
                <input
                  type="checkbox"
                  checked={checked}
                  disabled={locked || save.isPending}
                  aria-label={`${ROLE_LABEL[r]} role for ${row.original.displayName}`}
                  onChange={() => {
                    const roles = checked ? current.filter((x) => x !== r) : [...current, r];
                    setPending((p) => ({ ...p, [row.original.id]: roles }));
                    save.mutate({ id: row.original.id, roles });
                  }}
                />
                {ROLE_LABEL[r]}
              </label>
            );
          })}
        </div>
      ),
    }),
  ]);

  const table = useTable({
    features,
    columns,
    data: data?.accounts ?? EMPTY,
    globalFilterFn: "includesString",
    state: { globalFilter: filter },
    onGlobalFilterChange: (u) => setFilter(typeof u === "function" ? u(filter) : u),
  });

  if (isLoading) return <p className="text-flash-600">Loading accounts…</p>;
  if (error)
    return (
      <p role="alert" className="text-fault-700">
        {error.message}
      </p>
    );
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3">
        <label htmlFor="account-filter" className="label">
          Find
        </label>
        <input
          id="account-filter"
          className="input max-w-xs"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          placeholder="Name or e-mail"
        />
        {message ? (
          <p role="status" className="text-sm text-flash-700">
            {message}
          </p>
        ) : null}
      </div>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => (
                  <th
                    key={h.id}
                    scope="col"
                    className="px-3 py-2 font-medium"
                    aria-sort={
                      h.column.getIsSorted() === "asc"
                        ? "ascending"
                        : h.column.getIsSorted() === "desc"
                          ? "descending"
                          : undefined
                    }
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={h.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1"
                      >
                        <table.FlexRender header={h} />
                        <span aria-hidden="true">
                          {h.column.getIsSorted() === "asc" ? "▲" : h.column.getIsSorted() === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={h} />
                    )}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-flash-200">
                {row.getAllCells().map((c) => (
                  <td key={c.id} className="px-3 py-2 align-top">
                    <table.FlexRender cell={c} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
