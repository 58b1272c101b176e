using ThermVerify.Quantities;
using Tomlyn.Model;

namespace ThermVerify.Design;

/// <summary>The kinds of value the delta-sigma keys add: true/false, and a list of values with units.</summary>
internal sealed partial class TomlSection
{
    public bool? Boolean(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        return value as bool? ?? throw ErrorAtValue(key, $"\"{key}\" must be true or false", $"Write {key} = true or {key} = false (no quotes).");
    }

    /// <summary>A list of values with a unit, e.g. ["50 Hz", "60 Hz"]; each checked as <see cref="Quantity"/> checks one.</summary>
    public IReadOnlyList<double>? QuantityList(string key, Bound bound, int maximumCount, params UnitKind[] kinds)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        if (value is not TomlArray array || array.Count == 0)
            throw ErrorAtValue(key, $"\"{key}\" must be a list of values with units", $"Write e.g. {key} = [\"{ExampleUnit(kinds[0])}\"].");
        if (array.Count > maximumCount)
            throw ErrorAtValue(key, $"the list has {array.Count} entries, more than {maximumCount}", $"List at most {maximumCount}.");
        var list = new List<double>();
        foreach (var item in array)
        {
            // Each entry is read as if it were the key's only value, so it meets the same units, bounds and plausible range.
            var single = new TomlTable { [key] = item! };
            var one = new TomlSection(_context, single, Path, ValuePosition(key));
            list.Add(one.Quantity(key, bound, kinds)!.Value.Value);
        }
        return list;
    }
}
