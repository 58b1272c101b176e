namespace ThermVerify.Circuits;

/// <summary>Value checks shared by element records; each message says what, where and how to fix it.</summary>
internal static class ElementChecks
{
    public static void Name(Element element)
    {
        if (string.IsNullOrWhiteSpace(element.Name) || element.Name.Any(char.IsWhiteSpace))
            throw new CircuitException($"{element.GetType().Name} has the name '{element.Name}': give every element a non-empty name without spaces.");
        foreach (var node in element.Nodes)
            if (string.IsNullOrWhiteSpace(node) || node.Any(char.IsWhiteSpace))
                throw new CircuitException($"{element.Describe} has a node named '{node}': node names must be non-empty without spaces (ground is \"0\").");
    }

    public static void Finite(Element element, double value, string what)
    {
        if (!double.IsFinite(value))
            throw new CircuitException($"{element.Describe}: {what} is {value}; give a finite number.");
    }

    public static void Positive(Element element, double value, string what)
    {
        Finite(element, value, what);
        if (value <= 0)
            throw new CircuitException($"{element.Describe}: {what} is {value:G6}; it must be greater than zero.");
    }

    public static void NonNegative(Element element, double value, string what)
    {
        Finite(element, value, what);
        if (value < 0)
            throw new CircuitException($"{element.Describe}: {what} is {value:G6}; it must not be negative.");
    }

    public static void DistinctNodes(Element element, string a, string b)
    {
        if (a == b)
            throw new CircuitException($"{element.Describe} has both terminals on node '{a}': connect it between two different nodes or remove it.");
    }
}
