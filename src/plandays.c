/* plandays.c - which days of a week each visit takes (see plandays.h).
 *
 * A week has at most a few visits per mob (max_paddocks_per_week), so the
 * placement tries every order of them (up to 6 visits, 720 orders) and
 * lays each visit on the earliest run of free days after the one before:
 * the first order that fits wins.  When none fits (the model caps each
 * visit at the longest free run, but two visits may compete for the same
 * free days), the visits are laid end to end in the order that puts the
 * fewest grazing days on closed days, and the caller is told how many.  Orders are tried with the mob's
 * paddock of the week before first, then in paddock order, so the result
 * depends only on the plan.
 */
#include "plandays.h"

#include <string.h>

#define MAX_VISITS 6

typedef struct visit {
    int p, d;
} visit;

static unsigned mask_of(const plan_problem *pb, int p, int t)
{
    return pb->open_mask ? pb->open_mask[(size_t)p * pb->n_weeks + t] : 0x7fu;
}

/* Lays the visits in order v[0..n-1]; 1 when each finds free days. */
static int lay(const plan_problem *pb, int t, const visit *v, int n, int *first)
{
    int pos = 0;
    for (int i = 0; i < n; i++) {
        unsigned free_days = mask_of(pb, v[i].p, t);
        int s = pos, ok = 0;
        for (; s + v[i].d <= 7 && !ok; s++) {
            ok = 1;
            for (int k = s; k < s + v[i].d && ok; k++)
                ok = (free_days >> k) & 1u;
        }
        if (!ok)
            return 0;
        first[v[i].p] = s - 1;
        pos = s - 1 + v[i].d;
    }
    return 1;
}

/* Next permutation of v[0..n-1] in lexicographic order of index; 0 at the end. */
static int next_order(int *ix, int n)
{
    int i = n - 2;
    while (i >= 0 && ix[i] >= ix[i + 1])
        i--;
    if (i < 0)
        return 0;
    int j = n - 1;
    while (ix[j] <= ix[i])
        j--;
    int tmp = ix[i];
    ix[i] = ix[j];
    ix[j] = tmp;
    for (int a = i + 1, b = n - 1; a < b; a++, b--) {
        tmp = ix[a];
        ix[a] = ix[b];
        ix[b] = tmp;
    }
    return 1;
}

/* Closed days the visits in order v[0..n-1] hit when laid end to end
 * from the week's first day. */
static int clashes_end_to_end(const plan_problem *pb, int t, const visit *v, int n, int *first)
{
    int pos = 0, clash = 0;
    for (int i = 0; i < n; i++) {
        unsigned free_days = mask_of(pb, v[i].p, t);
        for (int k = pos; k < pos + v[i].d; k++)
            clash += !((free_days >> k) & 1u);
        first[v[i].p] = pos;
        pos += v[i].d;
    }
    return clash;
}

int pday_place(const plan_problem *pb, const plan *pl, int m, int t, int prev, int *first)
{
    if (!pb || !pl || !first || m < 0 || m >= pb->n_mobs || t < 0 || t >= pb->n_weeks)
        return -1;
    visit v[MAX_VISITS], order[MAX_VISITS];
    int n = 0, total = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        first[p] = -1;
        int d = pl->days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
        if (d <= 0)
            continue;
        total += d;
        if (d > 7 || n == MAX_VISITS || total > 7)
            return -1;
        /* the paddock of the week before goes first in the starting order */
        if (p == prev && n > 0) {
            memmove(v + 1, v, (size_t)n * sizeof *v);
            v[0] = (visit){p, d};
        } else {
            v[n] = (visit){p, d};
        }
        n++;
    }
    int ix[MAX_VISITS], best[MAX_VISITS], best_clash = 8;
    for (int i = 0; i < n; i++)
        ix[i] = i;
    do {
        for (int i = 0; i < n; i++)
            order[i] = v[ix[i]];
        if (lay(pb, t, order, n, first))
            return 0;
        int c = clashes_end_to_end(pb, t, order, n, first);
        if (c < best_clash) {
            best_clash = c;
            memcpy(best, ix, sizeof ix);
        }
    } while (next_order(ix, n));
    /* no order keeps every visit on free days: the one that hits fewest */
    for (int i = 0; i < n; i++)
        order[i] = v[best[i]];
    return clashes_end_to_end(pb, t, order, n, first);
}

int pday_last_of(const plan_problem *pb, const plan *pl, int m, int t, const int *first)
{
    int best = -1, best_end = -1;
    for (int p = 0; p < pb->n_paddocks; p++) {
        if (first[p] < 0)
            continue;
        int end = first[p] + pl->days[((size_t)m * pb->n_paddocks + p) * pb->n_weeks + t];
        if (end > best_end) {
            best_end = end;
            best = p;
        }
    }
    return best;
}
