import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { MailboxMessage } from "@/contracts/mailbox";

export const mailboxQueryOptions = queryOptions({
  queryKey: ["mailbox"],
  queryFn: () => get<MailboxMessage[]>("/api/mailbox"),
  refetchInterval: 5_000,
});

export const useMailbox = () => useQuery(mailboxQueryOptions);
