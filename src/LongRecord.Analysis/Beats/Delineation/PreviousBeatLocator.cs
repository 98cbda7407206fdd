namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Finds the previous beat's fiducial when the caller gives none because it lies before the window. Consecutive windows
/// of one recording overlap (each spans about 1.2 s around its beat, so at any rate above 50 bpm the start of this
/// window repeats the end of the previous one); the overlap holds the same samples, so the shift between the two
/// windows, and with it the previous fiducial, follows from where this window's first samples lie in the previous one.
/// The P window then starts after the previous T wave as it does when the caller passes the neighbour, instead of
/// reaching back into that T wave.
/// </summary>
internal sealed class PreviousBeatLocator
{
    // Samples that must agree exactly before a shift is checked over the whole overlap; a window whose first samples
    // are all equal (a flat lead) is not matched, since it would fit anywhere.
    private const int Probe = 8;

    private float[] _previous = [];
    private int _previousLength;
    private int _previousFiducial = -1;

    /// <summary>
    /// The previous beat's fiducial in this window's indices (before the window, so negative), or null when the
    /// windows do not overlap in exactly one way.
    /// </summary>
    public int? Locate(ReadOnlySpan<float> lead)
    {
        if (_previousFiducial < 0 || lead.Length < Probe || _previousLength < Probe)
        {
            return null;
        }

        var flat = true;
        for (var i = 1; i < Probe; i++)
        {
            flat &= lead[i] == lead[0];
        }

        if (flat)
        {
            return null;
        }

        var previous = _previous.AsSpan(0, _previousLength);
        var found = -1;
        for (var shift = _previousFiducial + 1; shift + Probe <= previous.Length; shift++)
        {
            if (previous[shift] != lead[0] || !previous.Slice(shift, Probe).SequenceEqual(lead[..Probe]))
            {
                continue;
            }

            var overlap = Math.Min(previous.Length - shift, lead.Length);
            if (!previous.Slice(shift, overlap).SequenceEqual(lead[..overlap]))
            {
                continue;
            }

            if (found >= 0)
            {
                return null; // two shifts fit: ambiguous
            }

            found = shift;
        }

        return found >= 0 ? _previousFiducial - found : null;
    }

    /// <summary>Keeps this beat's window (one lead) and fiducial for the next call.</summary>
    public void Remember(ReadOnlySpan<float> lead, int fiducial)
    {
        if (_previous.Length < lead.Length)
        {
            _previous = new float[lead.Length];
        }

        lead.CopyTo(_previous);
        _previousLength = lead.Length;
        _previousFiducial = fiducial;
    }

    /// <summary>Forgets the previous window (a lead with a gap cannot be matched).</summary>
    public void Forget() => _previousFiducial = -1;
}
