namespace LongRecord.Synthesis.Model;

/// <summary>
/// The beat model: each beat is a sum of Gaussian waves named P, Q, R, S and T, as in McSharry, Clifford, Tarassenko
/// and Smith, "A dynamical model for generating synthetic electrocardiogram signals", IEEE Trans Biomed Eng
/// 50(3):289–294, 2003. We place the Gaussians directly in time around each beat instead of integrating the paper's
/// ODE on a limit cycle.
/// <para>
/// The paper's parameters (Table 1, from memory): angles θ = (−π/3, −π/12, 0, π/12, π/2) rad, a = (1.2, −5, 30, −7.5,
/// 0.75), b = (0.25, 0.1, 0.1, 0.1, 0.4) rad for P, Q, R, S, T. At 60 bpm one revolution is 1 s, so these mean wave
/// times of −167, −42, 0, 42, 250 ms and widths b / 2π of 40, 16, 16, 16, 64 ms; the z amplitudes go as a·b², giving
/// R : P : T : Q : S ≈ 1 : 0.25 : 0.4 : −0.17 : −0.25. We keep the paper's T time (250 ms at RR 1 s) and its
/// amplitude ratios as the starting point for lead II; every other value below (narrower Q, R, S and P so that the QRS
/// is about 90 ms, per-lead amplitudes in mV, the ectopic, ventricular and P shapes) is ours.
/// </para>
/// <para>
/// Rate dependence (ours): Q, R and S keep their timing at every rate (QRS width does not change with rate); T's
/// centre and width scale with ∛RR (Fridericia-like rather than Bazett's √RR, which shortens QT too much at
/// tachycardia rates; RR clamped to 0.25…2 s, the RR being the one that ends at the beat), giving a QT near 0.40 s at
/// 75 bpm and 0.30 s at 170 bpm; the sinus PR shortens as RR^0.15.
/// </para>
/// </summary>
internal static class WaveCatalogue
{
    public const int Normal = 0;
    public const int VentricularA = 1;
    public const int VentricularB = 2;
    public const int VentricularTachycardia = 3;

    public const int PSinus = 0;
    public const int PInverted = 1;
    public const int PBiphasic = 2;
    public const int PNarrowUpright = 3;
    public const int PPeaked = 4;
    public const int PRetrograde = 5;
    public const int PNone = 255;

    /// <summary>T centre at RR = 1 s: the paper's θ_T = π/2 at 60 bpm.</summary>
    public const double TCenterAtOneSecondS = 0.25;

    public static readonly IReadOnlyList<BeatMorphology> Morphologies =
    [
        new("normal", false,
            [
                new("Q", -0.022, 0.0080, new(-0.15, 0.00, -0.15)),
                new("R", 0.000, 0.0095, new(1.10, 0.30, 1.40)),
                new("S", 0.024, 0.0080, new(-0.25, -0.85, -0.20)),
            ],
            [new("T", TCenterAtOneSecondS, 0.048, new(0.30, -0.06, 0.35))]),
        // Left-bundle-like ectopic focus: broad R in II and V5, deep broad S in V1, discordant T.
        new("ventricular-a", true,
            [
                new("R", 0.000, 0.020, new(0.95, 0.12, 1.30)),
                new("S", 0.040, 0.018, new(-0.30, -1.30, -0.10)),
            ],
            [new("T", 0.28, 0.060, new(-0.40, 0.45, -0.50))]),
        // Right-bundle-like focus: QS in II, broad R in V1, deep S in V5, discordant T.
        new("ventricular-b", true,
            [
                new("Q", -0.030, 0.014, new(-0.35, 0.00, -0.25)),
                new("R", 0.000, 0.022, new(-0.80, 1.25, 0.35)),
                new("S", 0.045, 0.020, new(-0.20, -0.15, -0.90)),
            ],
            [new("T", 0.30, 0.060, new(0.40, -0.45, 0.40))]),
        new("ventricular-tachycardia", true,
            [
                new("R", 0.000, 0.022, new(1.05, -0.30, 1.10)),
                new("S", 0.045, 0.020, new(-0.45, -1.10, -0.35)),
            ],
            [new("T", 0.27, 0.055, new(-0.45, 0.40, -0.45))]),
    ];

    public static readonly IReadOnlyList<PWaveShape> PShapes =
    [
        new("sinus", [new("P", 0.0, 0.022, new(0.20, 0.07, 0.10)), new("P", 0.025, 0.014, new(0.0, -0.05, 0.0))]),
        new("inverted", [new("P", 0.0, 0.018, new(-0.15, 0.08, -0.07))]),
        new("biphasic", [new("P", -0.016, 0.013, new(0.11, -0.06, 0.06)), new("P", 0.016, 0.013, new(-0.11, 0.06, -0.05))]),
        new("narrow-upright", [new("P", 0.0, 0.014, new(0.12, -0.09, 0.08))]),
        new("peaked", [new("P", 0.0, 0.017, new(0.26, 0.12, 0.12))]),
        new("retrograde", [new("P", 0.0, 0.016, new(-0.08, 0.04, -0.05))]),
    ];

    /// <summary>Peak-to-peak amplitude of the flutter sawtooth per view, mV (ours; negative = inverted sawtooth).</summary>
    public static readonly ViewAmplitudes FlutterWave = new(-0.20, 0.12, -0.06);

    /// <summary>Mean amplitude of fibrillatory waves per view, mV (ours: fine f waves in II, coarser in V1).</summary>
    public static readonly ViewAmplitudes FibrillatoryWave = new(0.035, 0.09, 0.03);

    /// <summary>Amplitude of ventricular flutter and fibrillation waves per view, mV (ours).</summary>
    public static readonly ViewAmplitudes VentricularWave = new(1.0, 0.8, 1.1);

    /// <summary>P shape names a scenario may ask for.</summary>
    public static int PShapeByName(string name)
    {
        for (var i = 0; i < PShapes.Count; i++)
        {
            if (PShapes[i].Name == name)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>Sinus P peak relative to the R wave centre (ours: PR 190 ms at 60 bpm, shortening as RR^0.15).</summary>
    public static double SinusPOffsetS(double rrS) => -0.17 * Math.Pow(Math.Clamp(rrS, 0.25, 2.0), 0.15);

    /// <summary>The ∛RR factor applied to T timing and width.</summary>
    public static double TScale(double rrS) => Math.Cbrt(Math.Clamp(rrS, 0.25, 2.0));
}
