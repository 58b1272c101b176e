using ThermVerify.Design;

namespace ThermVerify.Tolerances;

/// <summary>
/// A built unit's netlist: each [[netlist.part]] at its own value (the element's value scaled by its deviation) and
/// its own tempco (a bound spread about zero becomes the unit's value, written with its sign). The ratiometric
/// reference is the voltage of the source that drives the reference node, so a tolerance on that source moves the
/// unit's reference with it, as a divider's excitation tolerance moves a ratiometric divider's reference.
/// </summary>
internal static class NetlistUnit
{
    public static NetlistSpec Build(NetlistSpec nominal, ToleranceSet set, IReadOnlyList<double> deviations)
    {
        double Dev(ToleranceKind kind, string element)
        {
            var i = set.IndexOf(kind, element);
            return i < 0 ? 0 : deviations[i];
        }

        var fractions = nominal.Parsed.Elements.Where(e => set.IndexOf(ToleranceKind.NetlistPartValue, e.Name) >= 0)
            .ToDictionary(e => e.Name, e => Dev(ToleranceKind.NetlistPartValue, e.Name), StringComparer.OrdinalIgnoreCase);
        // Only a spread tempco becomes the unit's own: a tempco written with a sign, or none (where the card's tc1/tc2 count), stays as written.
        var parts = nominal.Parts
            .Select(p => set.IndexOf(ToleranceKind.NetlistPartTempco, p.Name) < 0 ? p : p with { TempcoPerKelvin = Dev(ToleranceKind.NetlistPartTempco, p.Name), TempcoSigned = true })
            .ToList();
        return nominal.WithScaledValues(fractions) with { Parts = parts };
    }
}
