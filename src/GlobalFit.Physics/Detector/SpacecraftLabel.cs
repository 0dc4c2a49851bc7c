namespace GlobalFit.Physics.Detector;

/// <summary>Checks and cyclic arithmetic on spacecraft labels 1, 2, 3.</summary>
public static class SpacecraftLabel
{
    /// <summary>The label after <paramref name="spacecraft"/> in the cycle 1 → 2 → 3 → 1.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The label is not 1, 2 or 3.</exception>
    public static int Next(int spacecraft)
    {
        Check(spacecraft, nameof(spacecraft));
        return spacecraft % 3 + 1;
    }

    /// <summary>Throws unless <paramref name="spacecraft"/> is 1, 2 or 3.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The label is not 1, 2 or 3.</exception>
    public static void Check(int spacecraft, string parameterName)
    {
        if (spacecraft is < 1 or > 3)
            throw new ArgumentOutOfRangeException(parameterName, spacecraft, "spacecraft are labelled 1, 2 and 3");
    }

    /// <summary>Throws unless both labels are valid and distinct, i.e. name a link.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A label is not 1, 2 or 3, or the two are equal.</exception>
    public static void CheckLink(int receiver, int sender)
    {
        Check(receiver, nameof(receiver));
        Check(sender, nameof(sender));
        if (receiver == sender)
            throw new ArgumentOutOfRangeException(nameof(sender), sender, "a link joins two different spacecraft");
    }
}
