package frame

import (
	"container/heap"
	"sort"
)

// graph is an undirected graph without self loops in compressed form: the
// neighbours of v are adj[xadj[v]:xadj[v+1]]. w[v] is the number of degrees
// of freedom of vertex v.
type graph struct {
	xadj []int32
	adj  []int32
	w    []int32
}

func (g *graph) n() int                     { return len(g.w) }
func (g *graph) neighbours(v int32) []int32 { return g.adj[g.xadj[v]:g.xadj[v+1]] }

// permute returns the graph with vertex perm[i] renamed i, each adjacency
// list sorted.
func (g *graph) permute(perm []int32) *graph {
	n := g.n()
	inv := make([]int32, n)
	for i, v := range perm {
		inv[v] = int32(i)
	}
	h := &graph{xadj: make([]int32, n+1), adj: make([]int32, len(g.adj)), w: make([]int32, n)}
	for i, v := range perm {
		nb := g.neighbours(v)
		h.xadj[i+1] = h.xadj[i] + int32(len(nb))
		out := h.adj[h.xadj[i]:h.xadj[i+1]]
		for k, u := range nb {
			out[k] = inv[u]
		}
		sortInt32(out)
		h.w[i] = g.w[v]
	}
	return h
}

func sortInt32(s []int32) { sort.Slice(s, func(a, b int) bool { return s[a] < s[b] }) }

// rcm returns the reverse Cuthill–McKee ordering of g (perm[i] is the vertex
// eliminated i-th): a breadth-first numbering from a pseudo-peripheral
// vertex of each component (George & Liu's algorithm), neighbours visited
// in increasing degree, then reversed. It keeps the profile small.
func rcm(g *graph) []int32 {
	n := g.n()
	perm := make([]int32, 0, n)
	done := make([]bool, n)
	level := make([]int32, n)
	mark := make([]int32, n)
	stamp := int32(0)
	var queue []int32
	var nb []int32
	for s0 := 0; s0 < n; s0++ {
		if done[s0] {
			continue
		}
		// Pseudo-peripheral start: repeat a breadth-first search from a
		// vertex of least degree in the last level while the eccentricity
		// grows.
		start := int32(s0)
		ecc := int32(-1)
		for iter := 0; iter < 8; iter++ {
			stamp++
			queue = append(queue[:0], start)
			mark[start] = stamp
			level[start] = 0
			for h := 0; h < len(queue); h++ {
				v := queue[h]
				for _, u := range g.neighbours(v) {
					if mark[u] != stamp {
						mark[u] = stamp
						level[u] = level[v] + 1
						queue = append(queue, u)
					}
				}
			}
			last := queue[len(queue)-1]
			e := level[last]
			if e <= ecc {
				break
			}
			ecc = e
			best := last
			for h := len(queue) - 1; h >= 0 && level[queue[h]] == e; h-- {
				if g.xadj[queue[h]+1]-g.xadj[queue[h]] < g.xadj[best+1]-g.xadj[best] {
					best = queue[h]
				}
			}
			start = best
		}
		// Cuthill–McKee numbering of the component.
		first := len(perm)
		perm = append(perm, start)
		done[start] = true
		for h := first; h < len(perm); h++ {
			nb = nb[:0]
			for _, u := range g.neighbours(perm[h]) {
				if !done[u] {
					done[u] = true
					nb = append(nb, u)
				}
			}
			sort.Slice(nb, func(a, b int) bool {
				da := g.xadj[nb[a]+1] - g.xadj[nb[a]]
				db := g.xadj[nb[b]+1] - g.xadj[nb[b]]
				if da != db {
					return da < db
				}
				return nb[a] < nb[b]
			})
			perm = append(perm, nb...)
		}
	}
	for i, j := 0, len(perm)-1; i < j; i, j = i+1, j-1 {
		perm[i], perm[j] = perm[j], perm[i]
	}
	return perm
}

// minDegree returns a minimum degree ordering of g: it repeatedly
// eliminates the vertex with the fewest degrees of freedom among its
// neighbours in the elimination graph (ties to the lowest index), joining
// its neighbours into a clique. The elimination graph is kept explicitly;
// once the remaining vertices form a clique they are taken in index order.
func minDegree(g *graph) []int32 {
	n := g.n()
	adj := make([][]int32, n)
	deg := make([]int64, n)
	for v := 0; v < n; v++ {
		nb := g.neighbours(int32(v))
		adj[v] = append(make([]int32, 0, len(nb)), nb...)
		for _, u := range nb {
			deg[v] += int64(g.w[u])
		}
	}
	gone := make([]bool, n)
	mark := make([]int32, n)
	for i := range mark {
		mark[i] = -1
	}
	h := make(degHeap, 0, n)
	for v := 0; v < n; v++ {
		h = append(h, degItem{deg[v], int32(v)})
	}
	heap.Init(&h)
	perm := make([]int32, 0, n)
	remaining := n
	var nb []int32
	for remaining > 0 {
		it := heap.Pop(&h).(degItem)
		v := it.v
		if gone[v] || it.deg != deg[v] {
			continue // stale entry
		}
		if len(adj[v]) == remaining-1 && isClique(adj, gone, remaining) {
			// The rest is one clique: any order gives the same fill.
			for u := 0; u < n; u++ {
				if !gone[u] {
					perm = append(perm, int32(u))
				}
			}
			break
		}
		gone[v] = true
		remaining--
		perm = append(perm, v)
		nb = append(nb[:0], adj[v]...)
		adj[v] = nil
		for _, u := range nb {
			// adj(u) ← adj(u) ∪ nb \ {u, v}
			list := adj[u][:0]
			for _, x := range adj[u] {
				if x != v {
					mark[x] = u
					list = append(list, x)
				}
			}
			mark[u] = u
			for _, x := range nb {
				if mark[x] != u {
					mark[x] = u
					list = append(list, x)
				}
			}
			adj[u] = list
			var d int64
			for _, x := range list {
				d += int64(g.w[x])
			}
			if d != deg[u] {
				deg[u] = d
				heap.Push(&h, degItem{d, u})
			}
		}
	}
	return perm
}

// isClique reports whether every remaining vertex is adjacent to all
// others.
func isClique(adj [][]int32, gone []bool, remaining int) bool {
	for u := range adj {
		if !gone[u] && len(adj[u]) != remaining-1 {
			return false
		}
	}
	return true
}

type degItem struct {
	deg int64
	v   int32
}

type degHeap []degItem

func (h degHeap) Len() int { return len(h) }
func (h degHeap) Less(i, j int) bool {
	if h[i].deg != h[j].deg {
		return h[i].deg < h[j].deg
	}
	return h[i].v < h[j].v
}
func (h degHeap) Swap(i, j int) { h[i], h[j] = h[j], h[i] }
func (h *degHeap) Push(x any)   { *h = append(*h, x.(degItem)) }
func (h *degHeap) Pop() any {
	old := *h
	it := old[len(old)-1]
	*h = old[:len(old)-1]
	return it
}
