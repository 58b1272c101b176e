namespace ThermVerify.Sensors;

/// <summary>A table point and where it came from (file line, or 1-based position in a list).</summary>
internal readonly record struct TableRow(TablePoint Point, int Line);
