package org.solmass.spark;

import org.apache.spark.api.java.Optional;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.TileBounces;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.Tile;
import scala.Tuple2;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The exchange of stage 2 of a city run (docs/city.md, "Stages") as flat arrays: one record per
 * (sending tile, receiving tile) pair and exchange, never one per receiver.
 * <ul>
 * <li>{@link Route}, once per tile, from its own first pass and the plan alone (no shuffle): which of
 * the ids its reflector lists name it owns, which it must receive and from which tile, and where each
 * reflector-list entry reads in the flat source of a bounce (its own entries first, then what each
 * sending tile sends, in tile order);</li>
 * <li>{@link Request}: what a tile needs from one other tile (its ids, ascending), shuffled once to
 * the owner and gathered into that tile's {@link Sends};</li>
 * <li>{@link Packet}: at each exchange, the values of a request's ids in the request's order.</li>
 * </ul>
 * A tile's own values never leave it. All are plain classes of arrays, registered with Kryo
 * ({@link CityKryo}).
 */
final class TileExchange {
    private TileExchange() {}

    /** The tile index owning each receiver of the plan, by global id. */
    static int[] owners(CityPlan plan) {
        int[] owner = new int[plan.receiverCount()];
        Arrays.fill(owner, -1);
        for (Tile t : plan.tiles()) for (int id : t.receivers()) owner[id] = t.index();
        return owner;
    }

    /** Tile {@code to} needs the values of {@code ids} (ascending) from the tile that owns them. */
    static final class Request implements Serializable {
        private static final long serialVersionUID = 1L;
        final int to;
        final int[] ids;

        Request(int to, int[] ids) {
            this.to = to;
            this.ids = ids;
        }
    }

    /** The values sent by tile {@code from} at one exchange: {@code width} per id of the request, in its order. */
    static final class Packet implements Serializable {
        private static final long serialVersionUID = 1L;
        final int from;
        final double[] values;

        Packet(int from, double[] values) {
            this.from = from;
            this.values = values;
        }
    }

    /** Where a tile's values come from at each exchange (computed once per tile). */
    static final class Route implements Serializable {
        private static final long serialVersionUID = 1L;
        final int tile;
        /** The tile's own entries (its first pass's ids). */
        final int own;
        /** The tiles it receives from, ascending, and how many ids from each. */
        final int[] from, count;
        /** The ids it receives, by sending tile, then ascending: the slots after its own entries. */
        final int[] foreign;
        /**
         * Per reflector-list entry (entries in order, each list in order): its slot, as
         * {@link TileBounces#slots} gives it for the map own id -> its entry, received id -> own + its place in {@link #foreign}.
         */
        final int[] slots;

        private Route(int tile, int own, int[] from, int[] count, int[] foreign, int[] slots) {
            this.tile = tile;
            this.own = own;
            this.from = from;
            this.count = count;
            this.foreign = foreign;
            this.slots = slots;
        }

        /**
         * @param owner {@link #owners}
         */
        static Route of(int tile, FirstPasses fp, int[] owner) {
            int[] ids = fp.ids();
            int own = ids.length;
            SlotMap slot = new SlotMap(own);
            for (int i = 0; i < own; i++) slot.put(ids[i], i);
            // one look-up per list entry: an id not held gets a provisional slot -2 - f (f: its number in
            // order of first sight) and the entry keeps it; the slots after sorting are filled in below
            int[] n = {0};
            TileBounces.forEachReflector(fp, j -> n[0]++);
            int[] slots = new int[n[0]];
            long[][] key = {new long[64]}; // owner tile, id of each id not held, in order of first sight
            int[] k = {0}, at = {0};
            TileBounces.forEachReflector(fp, j -> {
                int s = slot.get(j);
                if (s == -1) {
                    if (owner[j] < 0 || owner[j] == tile) throw new IllegalStateException("receiver " + j + " named by tile " + tile + " has no other owner");
                    s = -2 - k[0];
                    slot.put(j, s);
                    if (k[0] == key[0].length) key[0] = Arrays.copyOf(key[0], 2 * k[0]);
                    key[0][k[0]++] = ((long) owner[j] << 32) | j;
                }
                slots[at[0]++] = s;
            });
            long[] keys = Arrays.copyOf(key[0], k[0]);
            Arrays.sort(keys);
            int[] foreign = new int[keys.length], sorted = new int[keys.length]; // sorted[f]: the final place of the f-th id first seen
            List<int[]> runs = new ArrayList<>(); // tile, count
            for (int i = 0; i < keys.length; i++) {
                foreign[i] = (int) keys[i];
                sorted[-2 - slot.get(foreign[i])] = i;
                int o = (int) (keys[i] >>> 32);
                if (runs.isEmpty() || runs.get(runs.size() - 1)[0] != o) runs.add(new int[] {o, 0});
                runs.get(runs.size() - 1)[1]++;
            }
            for (int e = 0; e < slots.length; e++) if (slots[e] < 0) slots[e] = own + sorted[-2 - slots[e]];
            int[] from = new int[runs.size()], count = new int[runs.size()];
            for (int i = 0; i < from.length; i++) {
                from[i] = runs.get(i)[0];
                count[i] = runs.get(i)[1];
            }
            return new Route(tile, own, from, count, foreign, slots);
        }

        /** One request per tile it receives from, keyed by that tile. */
        List<Tuple2<Integer, Request>> requests() {
            List<Tuple2<Integer, Request>> l = new ArrayList<>(from.length);
            int at = 0;
            for (int i = 0; i < from.length; i++) {
                l.add(new Tuple2<>(from[i], new Request(tile, Arrays.copyOfRange(foreign, at, at + count[i]))));
                at += count[i];
            }
            return l;
        }

        /**
         * The flat source of one exchange: {@code head} (the tile's own values, or nothing), then
         * each sending tile's packet in {@link #from} order ({@code width} values per id).
         */
        double[] source(double[] head, Optional<Iterable<Packet>> got, int width) {
            List<Packet> l = new ArrayList<>();
            if (got.isPresent()) got.get().forEach(l::add);
            l.sort((a, b) -> Integer.compare(a.from, b.from));
            if (l.size() != from.length) throw new IllegalStateException("tile " + tile + " got " + l.size() + " packets, expected " + from.length);
            double[] src = Arrays.copyOf(head, head.length + width * foreign.length);
            int at = head.length;
            for (int i = 0; i < from.length; i++) {
                Packet p = l.get(i);
                if (p.from != from[i] || p.values.length != width * count[i])
                    throw new IllegalStateException("tile " + tile + " got an unexpected packet from tile " + p.from);
                System.arraycopy(p.values, 0, src, at, p.values.length);
                at += p.values.length;
            }
            return src;
        }
    }

    /** What a tile sends at each exchange: per receiving tile (ascending), the ids it asked for. */
    static final class Sends implements Serializable {
        private static final long serialVersionUID = 1L;
        final int[] to;
        final int[][] ids;

        private Sends(int[] to, int[][] ids) {
            this.to = to;
            this.ids = ids;
        }

        static Sends of(Iterable<Request> requests) {
            List<Request> l = new ArrayList<>();
            requests.forEach(l::add);
            l.sort((a, b) -> Integer.compare(a.to, b.to));
            int[] to = new int[l.size()];
            int[][] ids = new int[l.size()][];
            for (int i = 0; i < to.length; i++) {
                to[i] = l.get(i).to;
                ids[i] = l.get(i).ids;
            }
            return new Sends(to, ids);
        }

        /**
         * The packets of one exchange, keyed by receiving tile.
         *
         * @param ownIds the sending tile's ids, ascending
         * @param values {@code width} values per entry of {@code ownIds}
         */
        List<Tuple2<Integer, Packet>> packets(int tile, int[] ownIds, double[] values, int width) {
            List<Tuple2<Integer, Packet>> l = new ArrayList<>(to.length);
            for (int i = 0; i < to.length; i++) {
                int[] want = ids[i];
                double[] v = new double[width * want.length];
                for (int q = 0; q < want.length; q++) {
                    int p = Arrays.binarySearch(ownIds, want[q]);
                    if (p < 0) throw new IllegalStateException("tile " + tile + " does not hold receiver " + want[q]);
                    System.arraycopy(values, width * p, v, width * q, width);
                }
                l.add(new Tuple2<>(to[i], new Packet(tile, v)));
            }
            return l;
        }
    }

    /** Global id -> slot, open addressing with linear probing (ids are non-negative; -1 marks an empty cell). */
    static final class SlotMap {
        private int[] keys, values;
        private int size, shift;

        SlotMap(int expected) {
            allocate(Integer.highestOneBit(Math.max(16, 2 * expected)) << 1);
        }

        private void allocate(int cap) {
            keys = new int[cap];
            values = new int[cap];
            Arrays.fill(keys, -1);
            shift = 32 - Integer.numberOfTrailingZeros(cap);
            size = 0;
        }

        /** Fibonacci hashing (Knuth, The Art of Computer Programming vol. 3, 6.4): the top bits of id times 2^32 / golden ratio. */
        private int cell(int id) { return (id * 0x9E3779B9) >>> shift; }

        /** The slot of {@code id}, or -1 when absent. */
        int get(int id) {
            int mask = keys.length - 1;
            for (int c = cell(id); ; c = (c + 1) & mask) {
                if (keys[c] == id) return values[c];
                if (keys[c] < 0) return -1;
            }
        }

        void put(int id, int value) {
            if (2 * (size + 1) > keys.length) grow();
            int mask = keys.length - 1;
            int c = cell(id);
            while (keys[c] >= 0 && keys[c] != id) c = (c + 1) & mask;
            if (keys[c] < 0) size++;
            keys[c] = id;
            values[c] = value;
        }

        private void grow() {
            int[] k = keys, v = values;
            allocate(2 * k.length);
            for (int i = 0; i < k.length; i++) if (k[i] >= 0) put(k[i], v[i]);
        }
    }
}
