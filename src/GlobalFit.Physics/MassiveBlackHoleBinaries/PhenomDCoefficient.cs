namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The 19 phenomenological coefficients of IMRPhenomD that are fitted over mass ratio and spin.</summary>
/// <remarks>Khan et al. 2016, PRD 93, 044007 (arXiv:1508.07253), Table V; the order of the rows of that table.</remarks>
public enum PhenomDCoefficient
{
    /// <summary>Coefficient rho1 of the fit.</summary>
    Rho1,
    /// <summary>Coefficient rho2 of the fit.</summary>
    Rho2,
    /// <summary>Coefficient rho3 of the fit.</summary>
    Rho3,
    /// <summary>Coefficient v2 of the fit.</summary>
    V2,
    /// <summary>Coefficient gamma1 of the fit.</summary>
    Gamma1,
    /// <summary>Coefficient gamma2 of the fit.</summary>
    Gamma2,
    /// <summary>Coefficient gamma3 of the fit.</summary>
    Gamma3,
    /// <summary>Coefficient sigma1 of the fit.</summary>
    Sigma1,
    /// <summary>Coefficient sigma2 of the fit.</summary>
    Sigma2,
    /// <summary>Coefficient sigma3 of the fit.</summary>
    Sigma3,
    /// <summary>Coefficient sigma4 of the fit.</summary>
    Sigma4,
    /// <summary>Coefficient beta1 of the fit.</summary>
    Beta1,
    /// <summary>Coefficient beta2 of the fit.</summary>
    Beta2,
    /// <summary>Coefficient beta3 of the fit.</summary>
    Beta3,
    /// <summary>Coefficient alpha1 of the fit.</summary>
    Alpha1,
    /// <summary>Coefficient alpha2 of the fit.</summary>
    Alpha2,
    /// <summary>Coefficient alpha3 of the fit.</summary>
    Alpha3,
    /// <summary>Coefficient alpha4 of the fit.</summary>
    Alpha4,
    /// <summary>Coefficient alpha5 of the fit.</summary>
    Alpha5,
}
