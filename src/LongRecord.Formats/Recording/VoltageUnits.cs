namespace LongRecord.Formats;

/// <summary>Recognises the voltage units recorders write and converts them to millivolts.</summary>
public static class VoltageUnits
{
    /// <summary>
    /// Millivolts per one <paramref name="unit"/>. An empty unit is taken as millivolts, the WFDB default
    /// (WFDB Applications Guide, header(5): "if the units field is absent, the physical units are millivolts").
    /// Returns NaN for units that are not voltages.
    /// </summary>
    public static double MillivoltsPer(string unit)
    {
        var u = unit.Trim();
        return u switch
        {
            "" or "mV" or "mv" => 1.0,
            "uV" or "uv" or "µV" or "μV" or "UV" => 1e-3,
            "nV" or "nv" => 1e-6,
            "V" or "v" => 1e3,
            _ => double.NaN,
        };
    }
}
