/** A player's progress: figures per finished exchange they sat in, and their totals. */
import { Op } from 'sequelize';
import type { ProgressDto, ProgressPointDto } from '../../../shared/progress';
import { seatOfUser } from '../../../shared/seats';
import { ExchangeRow, type User } from '../../db/models';
import { figuresFor } from '../../services/exchange-stats';

/** The most recent exchanges counted (each takes the advice for every pass, so there is a bound). */
const PROGRESS_MAX = 200;

const share = (n: number, of: number) => (of ? n / of : null);

export async function progressOf(user: Pick<User, 'id' | 'displayName'>): Promise<ProgressDto> {
  const rows = await ExchangeRow.findAll({
    where: { status: 'done', participants: { [Op.like]: `%,${user.id},%` } },
    order: [['finishedAt', 'DESC']],
    limit: PROGRESS_MAX + 1,
  });
  const counted = rows.slice(0, PROGRESS_MAX).reverse();
  const figures = await figuresFor(counted, (r) => [seatOfUser(r.seats, user.id)!], true);
  const points = counted.map((row): ProgressPointDto => {
    const seat = seatOfUser(row.seats, user.id)!;
    const f = figures.get(row.id)!.seats[seat]!;
    return {
      exchangeId: row.id,
      tableName: row.tableName,
      finishedAt: (row.finishedAt ?? row.startedAt).toISOString(),
      seat,
      awayBefore: f.awayBefore,
      awayAfter: f.awayAfter,
      gained: f.awayBefore - f.awayAfter,
      passes: f.passes.length,
      asAdvised: f.passes.filter((p) => p.asAdvised).length,
      brokePair: f.passes.filter((p) => p.brokePair).length,
      passedFlower: f.passes.filter((p) => p.passedFlower).length,
    };
  });
  const sum = (pick: (p: ProgressPointDto) => number) => points.reduce((a, p) => a + pick(p), 0);
  const passes = sum((p) => p.passes);
  return {
    user: { id: user.id, displayName: user.displayName },
    totals: {
      exchanges: points.length,
      passes,
      meanGained: points.length ? sum((p) => p.gained) / points.length : null,
      asAdvisedRate: share(sum((p) => p.asAdvised), passes),
      brokePairRate: share(sum((p) => p.brokePair), passes),
      passedFlowerRate: share(sum((p) => p.passedFlower), passes),
    },
    points,
    truncated: rows.length > PROGRESS_MAX,
  };
}
