using System.Collections.Immutable;

namespace GlobalFit.Inference.Proposals;

/// <summary>Validation shared by every settings record that carries a proposal mixture.</summary>
internal static class ProposalMixtureValidation
{
    public static void Validate(ImmutableArray<ProposalSpec> proposals, string fieldName)
    {
        if (proposals.IsDefaultOrEmpty)
        {
            throw new ArgumentException($"{fieldName} must contain at least one proposal.", fieldName);
        }

        double total = 0.0;
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (ProposalSpec spec in proposals)
        {
            if (spec is null || spec.Create is null || string.IsNullOrWhiteSpace(spec.Name))
            {
                throw new ArgumentException($"{fieldName} contains an incomplete entry.", fieldName);
            }

            if (!(spec.Weight >= 0.0) || double.IsInfinity(spec.Weight))
            {
                throw new ArgumentException($"{fieldName}: weight of '{spec.Name}' must be finite and non-negative.", fieldName);
            }

            if (!names.Add(spec.Name))
            {
                throw new ArgumentException($"{fieldName}: name '{spec.Name}' appears twice.", fieldName);
            }

            total += spec.Weight;
        }

        if (!(total > 0.0))
        {
            throw new ArgumentException($"{fieldName}: weights must have a positive sum.", fieldName);
        }
    }
}
