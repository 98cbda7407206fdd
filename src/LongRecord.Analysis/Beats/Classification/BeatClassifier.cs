namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Streaming beat classifier (EC57 classes N, S, V, F, Q) for one recording. Beats arrive in time order with their
/// conditioned signal window; each beat's class is decided when the next beat arrives (the compensatory pause needs
/// the following RR), or at <see cref="Flush"/>. Memory is fixed: a small set of morphology templates and the last
/// few RRs. Nothing is learned from annotated data: templates are built from the recording itself.
/// </summary>
public sealed class BeatClassifier
{
    private readonly double _fs;
    private readonly ClassificationSettings _settings;
    private readonly ShapeExtractor _extractor;
    private readonly TemplateSet _templates;
    private readonly RhythmContext _rhythm;
    private readonly BeatShape _shape;
    private readonly Queue<ClassifiedBeat> _decided = new();
    private readonly BeatDecision _decision;
    private readonly NoiseFloor _noise;
    private readonly TemplateQrs _templateQrs;

    private float[] _previousAtrial;
    private bool _previousAtrialValid;
    private Pending? _pending;
    private long _lastSample = -1;

    public BeatClassifier(double samplingRateHz, int leads, ClassificationSettings? settings = null)
    {
        if (samplingRateHz <= 0 || leads <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(samplingRateHz), "sampling rate and lead count must be positive");
        }

        _fs = samplingRateHz;
        _settings = settings ?? ClassificationSettings.Default;
        _extractor = new ShapeExtractor(samplingRateHz, leads, _settings);
        _templates = new TemplateSet(leads, _extractor.Segment, _extractor.AtrialLength, _settings);
        _rhythm = new RhythmContext(_settings);
        _shape = _extractor.NewShape();
        _decision = new BeatDecision(_settings, _rhythm);
        _noise = new NoiseFloor(_settings);
        // 150 ms on either side of the template's segment: room for the delineator's low-pass to settle and for its
        // noise estimate, which leaves out 120 ms around the QRS centre (our choice).
        _templateQrs = new TemplateQrs(samplingRateHz, leads, _extractor.Segment, (int)Math.Round(0.15 * samplingRateHz));
        _previousAtrial = new float[_shape.Atrial.Length];
    }

    /// <summary>Beats decided and not yet taken.</summary>
    public int Ready => _decided.Count;

    /// <summary>
    /// Adds the next beat. <paramref name="window"/> holds <paramref name="length"/> conditioned samples of every lead,
    /// lead-major (lead k at k × length), around the fiducial, which is at <paramref name="fiducialIndex"/> in it
    /// (about 0.5 s before to 0.7 s after is what the features need).
    /// </summary>
    public void Add(long fiducial, ReadOnlySpan<float> window, int length, int fiducialIndex, in BeatMeasurements measurements)
    {
        if (fiducial <= _lastSample)
        {
            throw new ArgumentException($"beats must come in time order: {fiducial} after {_lastSample}", nameof(fiducial));
        }

        var rrS = _lastSample < 0 ? double.NaN : (fiducial - _lastSample) / _fs;
        var reference = _rhythm.RecentMedian(9);
        var onTime = double.IsNaN(rrS) || double.IsNaN(reference) || rrS >= _settings.PrematureRatio * reference;

        var beat = new Pending { Sample = fiducial, RrPrevS = rrS, PWave = measurements.PWave };
        if (_extractor.Extract(window, length, fiducialIndex, _shape))
        {
            var width = float.IsNaN(measurements.QrsWidthMs) ? _shape.SpreadMs : measurements.QrsWidthMs;
            var noiseResidual = _noise.ResidualFor(_shape.NoiseLevel);
            var energy = _shape.TotalEnergy();
            var correction = _noise.Correction(noiseResidual, energy);
            var match = _templates.Assign(_shape, onTime, float.IsNaN(measurements.QrsWidthMs) ? double.NaN : measurements.QrsWidthMs, correction);
            _noise.Add(match.Residual, _shape.NoiseLevel);
            beat.SameShapeCorrelation = NoiseFloor.SameShapeCorrelation(noiseResidual, energy);
            beat.Valid = true;
            beat.Template = match.Template.Id;
            beat.NewShape = match.Created;
            beat.WidthMs = width;
            beat.Noise = _shape.NoiseRatio;
            if (_shape.NoiseRatio > _settings.NoisyWidthRatio
                && _templateQrs.TryGet(match.Template, _extractor.Before, _settings.NoisyWidthTemplateBeats, out var on, out var off, out var templateMs))
            {
                // A noisy window: the boundaries of the beat's template, placed where the template matched it.
                var segmentStart = _shape.CentreIndex - _extractor.Before + match.Shift;
                beat.TemplateQrs = (segmentStart + on - fiducialIndex, segmentStart + off - fiducialIndex, templateMs);
            }

            var t = match.Template;
            beat.TemplatePrematureShare = t.Weight > 0 ? t.PrematureWeight / t.Weight : 0;
            beat.TemplateVentricularShare = t.Weight > 0 ? t.VentricularWeight / t.Weight : 0;
            var normal = _templates.Normal!;
            beat.IsNormalTemplate = normal == match.Template;
            if (beat.IsNormalTemplate)
            {
                (beat.CorrelationToNormal, beat.AmplitudeToNormal) = (match.Correlation, match.Amplitude);
            }
            else
            {
                var (c, a, _) = _templates.BestShift(_shape, normal);
                (beat.CorrelationToNormal, beat.AmplitudeToNormal) = (Math.Min(1, c * correction), a / correction);
            }

            beat.AtrialCorrelation = TemplateSet.AtrialCorrelation(_shape, normal);
            beat.AtrialToPrevious = _previousAtrialValid ? Correlation(_shape.Atrial, _previousAtrial) : double.NaN;
            _shape.Atrial.CopyTo(_previousAtrial, 0);
            _previousAtrialValid = true;
            var normalWidth = float.IsNaN(measurements.QrsWidthMs) || double.IsNaN(normal.WidthMs) ? normal.SpreadMs : normal.WidthMs;
            if (beat.TemplateQrs is var (_, _, ms) && _templateQrs.TryGet(normal, _extractor.Before, _settings.NoisyWidthTemplateBeats, out _, out _, out var normalMs))
            {
                // Both widths from template means: the noisy beat's width is judged against the normal template's, not
                // against the normal beats' own widths, which the same noise widens.
                beat.WidthMs = ms;
                width = ms;
                normalWidth = normalMs;
            }

            beat.ExtraWidthMs = width - normalWidth;
            beat.NormalWidthMs = normalWidth;

            // In a noisy window a measured width scatters as the normal beats' widths do there: for a normal
            // distribution the lower quartile lies 0.674 standard deviations below the mean, and a beat counts as
            // narrower only beyond two of them. Clean windows keep the fixed limit (such windows were Q before noise
            // was judged, so no decision on a clean beat changes).
            var widthSd = double.IsNaN(normal.WidthMs) || double.IsNaN(normal.WidthLowerQuartileMs) ? 0 : Math.Max(0, (normal.WidthMs - normal.WidthLowerQuartileMs) / 0.674);
            beat.NarrowerLimitMs = _shape.NoiseRatio > _settings.NoiseLimit ? Math.Max(_settings.NarrowerMs, 2 * widthSd) : _settings.NarrowerMs;
            beat.NormalBlocked = normal.WidthCount >= _settings.BundleBranchBlockBeats
                && normal.WidthLowerQuartileMs >= _settings.BundleBranchBlockMs;
        }

        else
        {
            _previousAtrialValid = false;
        }

        if (_pending is Pending previous)
        {
            Decide(previous, rrS);
        }

        if (!double.IsNaN(rrS))
        {
            _rhythm.AddRr(rrS, _decision.PreviousClass is BeatClass.V or BeatClass.S);
        }

        _pending = beat;
        _lastSample = fiducial;
    }

    /// <summary>Takes the oldest decided beat.</summary>
    public bool TryTake(out ClassifiedBeat beat) => _decided.TryDequeue(out beat);

    /// <summary>Ends the recording: the last beat is decided without a following RR.</summary>
    public void Flush()
    {
        if (_pending is Pending last)
        {
            Decide(last, double.NaN);
            _pending = null;
        }
    }

    private void Decide(Pending beat, double rrNextS)
    {
        var (cls, flags) = _decision.Decide(beat, rrNextS);
        if (cls == BeatClass.V && beat.Valid)
        {
            _templates.MarkVentricular(beat.Template);
        }

        _decided.Enqueue(new ClassifiedBeat(beat.Sample, cls, beat.Valid ? beat.Template : (short)-1, flags, beat.Valid ? beat.WidthMs : float.NaN)
        {
            TemplateQrs = beat.TemplateQrs,
        });
    }

    private static double Correlation(ReadOnlySpan<float> x, ReadOnlySpan<float> y)
    {
        double dot = 0, ex = 0, ey = 0;
        for (var i = 0; i < x.Length; i++)
        {
            dot += x[i] * y[i];
            ex += x[i] * x[i];
            ey += y[i] * y[i];
        }

        return ex > 0 && ey > 0 ? dot / Math.Sqrt(ex * ey) : double.NaN;
    }

    internal struct Pending
    {
        public long Sample;
        public double RrPrevS;
        public sbyte PWave;
        public bool Valid;
        public short Template;
        public bool IsNormalTemplate;
        public double CorrelationToNormal;
        public double AmplitudeToNormal;
        public float WidthMs;
        public double ExtraWidthMs;
        public double NormalWidthMs;
        public double NarrowerLimitMs;
        public bool NormalBlocked;
        public float Noise;
        public double SameShapeCorrelation;
        public double TemplatePrematureShare;
        public double TemplateVentricularShare;
        public double AtrialCorrelation;
        public double AtrialToPrevious;
        public bool NewShape;
        public (int OnOffset, int OffOffset, float Ms)? TemplateQrs;
    }
}
