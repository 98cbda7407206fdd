namespace LongRecord.Formats.Edf;

/// <summary>
/// Annotation TALs waiting for a data record, ordered by the record they belong in and then by arrival. Drained from the
/// front as records are written; a head index keeps draining cheap when many annotations are queued at once.
/// </summary>
internal sealed class EdfAnnotationQueue
{
    private readonly List<(int Record, byte[] Tal)> _items = [];
    private int _head;

    public int Count => _items.Count - _head;

    public void Add(int record, byte[] tal)
    {
        // Insert after every queued TAL of the same or an earlier record (stable for equal records).
        int lo = _head, hi = _items.Count;
        while (lo < hi)
        {
            var mid = (lo + hi) >> 1;
            if (_items[mid].Record <= record)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        _items.Insert(lo, (record, tal));
    }

    /// <summary>Copies queued TALs due by <paramref name="record"/> into <paramref name="destination"/> while they fit; returns bytes used.</summary>
    public int Drain(int record, Span<byte> destination)
    {
        var used = 0;
        while (_head < _items.Count && _items[_head].Record <= record && _items[_head].Tal.Length <= destination.Length - used)
        {
            var tal = _items[_head].Tal;
            tal.CopyTo(destination[used..]);
            used += tal.Length;
            _head++;
        }

        if (_head > 64 && _head * 2 > _items.Count)
        {
            _items.RemoveRange(0, _head);
            _head = 0;
        }

        return used;
    }
}
