interface TreapNode {
  readonly item: number;
  readonly priority: number;
  left: TreapNode | null;
  right: TreapNode | null;
  parent: TreapNode | null;
}

/**
 * The sweep's ordered set: a treap (a binary search tree kept balanced by
 * random priorities) whose nodes are found by item, so a segment leaves in
 * O(log n) expected time however its neighbours compare at that moment.
 */
export class SweepStatus {
  private root: TreapNode | null = null;
  private readonly nodes = new Map<number, TreapNode>();
  // A fixed-seed xorshift keeps the geometry deterministic.
  private seed = 0x2545f491;
  constructor(private readonly compare: (a: number, b: number) => number) {}

  private nextPriority(): number {
    this.seed ^= this.seed << 13;
    this.seed ^= this.seed >>> 17;
    this.seed ^= this.seed << 5;
    return this.seed >>> 0;
  }

  insert(item: number): void {
    const node: TreapNode = { item, priority: this.nextPriority(), left: null, right: null, parent: null };
    this.nodes.set(item, node);
    let at = this.root;
    while (at) {
      const goLeft = this.compare(item, at.item) < 0;
      const child = goLeft ? at.left : at.right;
      if (!child) {
        if (goLeft) at.left = node;
        else at.right = node;
        node.parent = at;
        break;
      }
      at = child;
    }
    if (!this.root) this.root = node;
    while (node.parent && node.priority < node.parent.priority) this.rotateUp(node);
  }

  remove(item: number): void {
    const node = this.nodes.get(item);
    if (!node) return;
    while (node.left || node.right) {
      const child = !node.left ? node.right! : !node.right ? node.left : node.left.priority < node.right.priority ? node.left : node.right;
      this.rotateUp(child);
    }
    if (!node.parent) this.root = null;
    else if (node.parent.left === node) node.parent.left = null;
    else node.parent.right = null;
    this.nodes.delete(item);
  }

  previous(item: number): number | null {
    return this.neighbour(item, 'left');
  }

  next(item: number): number | null {
    return this.neighbour(item, 'right');
  }

  private neighbour(item: number, side: 'left' | 'right'): number | null {
    const other = side === 'left' ? 'right' : 'left';
    let node = this.nodes.get(item) ?? null;
    if (!node) return null;
    if (node[side]) {
      node = node[side];
      while (node[other]) node = node[other];
      return node.item;
    }
    while (node.parent && node.parent[side] === node) node = node.parent;
    return node.parent ? node.parent.item : null;
  }

  private rotateUp(node: TreapNode): void {
    const parent = node.parent!;
    const grand = parent.parent;
    if (parent.left === node) {
      parent.left = node.right;
      if (node.right) node.right.parent = parent;
      node.right = parent;
    } else {
      parent.right = node.left;
      if (node.left) node.left.parent = parent;
      node.left = parent;
    }
    parent.parent = node;
    node.parent = grand;
    if (!grand) this.root = node;
    else if (grand.left === parent) grand.left = node;
    else grand.right = node;
  }
}
