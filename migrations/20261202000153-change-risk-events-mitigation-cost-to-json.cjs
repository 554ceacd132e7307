'use strict';

// A response's cost may be a range: the column holds a number (a fixed amount) or a
// distribution of the model file, as a line's rate per day does. Stored numbers stay valid JSON.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.changeColumn('RiskEvents', 'mitigationCost', {
      type: Sequelize.JSON,
      allowNull: true,
    });
  },
  async down(queryInterface, Sequelize) {
    // A range has no single number: back to its most likely value, or its midpoint, or nothing.
    await queryInterface.sequelize.query(
      `UPDATE RiskEvents SET mitigationCost = COALESCE(
         JSON_VALUE(mitigationCost, '$.mode'), JSON_VALUE(mitigationCost, '$.value'),
         (JSON_VALUE(mitigationCost, '$.low') + JSON_VALUE(mitigationCost, '$.high')) / 2)
       WHERE JSON_TYPE(mitigationCost) = 'OBJECT'`,
    );
    await queryInterface.changeColumn('RiskEvents', 'mitigationCost', {
      type: Sequelize.DOUBLE,
      allowNull: true,
    });
  },
};
