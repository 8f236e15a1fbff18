// A game's status: always a word and an icon beside the colour, never colour alone.
import { CircleCheck, TriangleAlert, OctagonX, Wrench } from 'lucide-react';
import { gameStatusLabels, type GameStatus } from '@bumperline/contracts/game-vocabulary';

const styles: Record<GameStatus, { className: string; Icon: typeof CircleCheck }> = {
  running: { className: 'bg-running-tint text-running', Icon: CircleCheck },
  attention: { className: 'bg-attention-tint text-attention', Icon: TriangleAlert },
  down: { className: 'bg-down-tint text-down', Icon: OctagonX },
  in_shop: { className: 'bg-shop-tint text-shop', Icon: Wrench },
};

export function GameStatusBadge({ status }: { status: GameStatus }) {
  const { className, Icon } = styles[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${className}`}>
      <Icon aria-hidden className="size-4" />
      {gameStatusLabels[status]}
    </span>
  );
}
