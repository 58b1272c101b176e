namespace ThermVerify.Quantities;

/// <summary>A number with its kind; <see cref="Value"/> is in the SI unit of <see cref="Unit"/> (see <see cref="UnitKind"/>).</summary>
internal readonly record struct Quantity(double Value, UnitKind Unit)
{
    public override string ToString() => EngineeringFormat.Format(Value, Unit);
}

/// <summary>A closed interval of one kind of quantity, <see cref="Min"/> below <see cref="Max"/>, both in SI units.</summary>
internal readonly record struct QuantityRange(double Min, double Max, UnitKind Unit)
{
    public override string ToString() => EngineeringFormat.FormatRange(Min, Max, Unit);
}
