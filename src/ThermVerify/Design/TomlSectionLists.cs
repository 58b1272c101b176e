using Tomlyn.Model;

namespace ThermVerify.Design;

/// <summary>Keys that name one thing or several: a string, or an array of strings.</summary>
internal sealed partial class TomlSection
{
    public IReadOnlyList<string>? Strings(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        if (value is string one)
            return [Text(key, one)];
        if (value is TomlArray array && array.All(v => v is string))
            return [.. array.Select(v => Text(key, (string)v!))];
        throw ErrorAtValue(key, $"\"{key}\" must be a name or a list of names", $"Write {key} = \"R1\" or {key} = [\"R1\", \"R2\"].");
    }
}
