using System.Diagnostics;
using LongRecord.Analysis.Beats.Classification;
using LongRecord.Analysis.Beats.Delineation;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// The per-beat half of the beats stage: delineates each detected beat from its window of conditioned signal, drops a
/// second detection that delineation places on the same complex, and classifies the beat. Fed the beats of one
/// recording in time order; its answers come out in the same order whichever thread runs it.
/// </summary>
internal sealed class BeatFinisher
{
    private readonly BeatDelineator _delineator;
    private readonly BeatClassifier _classifier;
    private readonly bool _given;
    private readonly int _leads;
    private readonly BeatStageTimings _timings;
    private readonly Queue<Beat> _undecided = new();
    private long _lastSample = -1;

    public BeatFinisher(double samplingRateHz, int leads, bool givenBeats, BeatStageTimings timings)
    {
        _delineator = new BeatDelineator(samplingRateHz, leads);
        _classifier = new BeatClassifier(samplingRateHz, leads);
        _given = givenBeats;
        _leads = leads;
        _timings = timings;
    }

    /// <summary>Delineates and classifies one beat; every beat the classifier has decided goes to <paramref name="decided"/>.</summary>
    public void Finish(in BeatJob job, ReadOnlySpan<float> window, Action<Beat> decided)
    {
        if (TryDelineate(job, window, out var beat, out var r))
        {
            Classify(beat, r, job, window, decided);
        }
    }

    /// <summary>
    /// The first half of <see cref="Finish"/>: delineates the beat and places it in time. False when delineation puts
    /// it on the complex of the beat before (a second detection, not a beat). <paramref name="r"/> is the beat's
    /// point inside its window.
    /// </summary>
    public bool TryDelineate(in BeatJob job, ReadOnlySpan<float> window, out Beat beat, out int r)
    {
        window = window[..(_leads * job.Length)];
        var t0 = Stopwatch.GetTimestamp();
        var d = _delineator.Delineate(window, job.Length, job.At, new DelineationContext(job.Previous, job.Next, 0));
        _timings.Delineation += Stopwatch.GetTimestamp() - t0;

        // The beat's point in time is the dominant deflection of its QRS where delineation found one (given beats
        // keep the time the annotation file gives).
        r = d.RPeak >= 0 && !_given && job.First + d.RPeak > _lastSample ? d.RPeak : job.At;
        if (job.First + r <= _lastSample)
        {
            // Two detections that delineation places on one complex: the second is not a beat.
            beat = default;
            return false;
        }

        _lastSample = job.First + r;
        beat = new Beat
        {
            Sample = job.First + r,
            QrsOnOffset = Offset(d.QrsOnset, r),
            QrsOffOffset = Offset(d.QrsOffset, r),
            PPeakOffset = Offset(d.PPeak, r),
            TEndOffset = Offset(d.TEnd, r),
            QrsMs = d.HasQrsBounds ? d.QrsMs : float.NaN,
            Template = -1,
            Class = BeatClass.Q,
            PWave = d.PWave,
            LeadQuality = LeadQuality.Good,
            Flags = _given ? BeatFlags.FromAnnotation : BeatFlags.None,
        };
        if (job.GivenClass is BeatClass reviewed)
        {
            // Reviewed labels are kept; the classifier still sees the beat for its templates and rhythm.
            beat.Class = reviewed;
            beat.Flags |= BeatFlags.Labelled;
        }

        return true;
    }

    /// <summary>
    /// The second half of <see cref="Finish"/>, for a beat <see cref="TryDelineate"/> kept, in the same order; every
    /// beat the classifier has decided goes to <paramref name="decided"/>.
    /// </summary>
    public void Classify(in Beat beat, int r, in BeatJob job, ReadOnlySpan<float> window, Action<Beat> decided)
    {
        var t0 = Stopwatch.GetTimestamp();
        _classifier.Add(beat.Sample, window[..(_leads * job.Length)], job.Length, r, new BeatMeasurements(beat.QrsMs, beat.PWave));
        _timings.Classification += Stopwatch.GetTimestamp() - t0;
        _undecided.Enqueue(beat);
        TakeClassified(decided);
    }

    /// <summary>Ends the recording: the classifier decides its last beats.</summary>
    public void Flush(Action<Beat> decided)
    {
        _classifier.Flush();
        TakeClassified(decided);
    }

    private static short Offset(int index, int reference) => index < 0 ? Beat.Unknown : (short)Math.Clamp(index - reference, short.MinValue + 1, short.MaxValue);

    // The classifier decides a beat once the next one is known; pair its answers with the beats waiting for them.
    private void TakeClassified(Action<Beat> decided)
    {
        while (_classifier.TryTake(out var c))
        {
            var beat = _undecided.Dequeue();
            if (beat.Sample != c.Sample)
            {
                throw new InvalidOperationException($"classifier answered for sample {c.Sample}, expected {beat.Sample}");
            }

            if ((beat.Flags & BeatFlags.Labelled) == 0)
            {
                beat.Class = c.Class;
                beat.Flags |= c.Flags;
            }

            beat.Template = c.Template;
            if (c.TemplateQrs is var (on, off, ms))
            {
                beat.QrsOnOffset = (short)on;
                beat.QrsOffOffset = (short)off;
                beat.QrsMs = ms;
            }

            decided(beat);
        }
    }
}

/// <summary>
/// One detected beat handed to the <see cref="BeatFinisher"/>: where its window starts in the recording, its length,
/// the fiducial inside it, and the neighbouring detections inside the window, all decided when the beat was taken.
/// </summary>
internal readonly record struct BeatJob(long First, int Length, int At, int? Previous, int? Next, BeatClass? GivenClass);
