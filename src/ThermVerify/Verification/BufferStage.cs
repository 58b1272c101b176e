using ThermVerify.Circuits;
using ThermVerify.Design;

namespace ThermVerify.Verification;

/// <summary>The op-amp buffer between the divider and the filter.</summary>
internal static class BufferStage
{
    /// <summary>Adds the buffer driven from <paramref name="input"/>; returns the node that drives the filter.</summary>
    public static string Add(List<Element> elements, BufferSpec buffer, string input) =>
        throw new NotSupportedException("buffered designs are not verified yet: the op-amp macro-model is not in the engine");
}
